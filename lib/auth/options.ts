import "server-only";
import type { NextAuthOptions } from "next-auth";
import type { JWT } from "next-auth/jwt";
import CredentialsProvider from "next-auth/providers/credentials";
import { endSession, type SessionClaims } from "@/lib/data/actors";
import { servedOverHttps } from "@/lib/security/headers";
import { clientAddress } from "./client-address";
import { authorizeCredentials, type SignedInUser } from "./credentials";

/**
 * Secure cookies whenever the public URL is https. Decided from NEXTAUTH_URL alone (not from
 * forwarded headers), the same rule `getToken` in proxy.ts uses to pick the cookie's name; over
 * plain http locally the cookie stays usable.
 */
export function secureCookiesFor(publicUrl: string | undefined): boolean {
  return servedOverHttps(publicUrl);
}

/** The claims a session token carries, or null for a token without them (signed out). */
export function claimsOf(token: Pick<JWT, "sub"> & { sv?: unknown }): SessionClaims | null {
  const userId = Number(token.sub);
  const sessionVersion = token.sv;
  if (!Number.isSafeInteger(userId) || userId <= 0) return null;
  if (typeof sessionVersion !== "number" || !Number.isSafeInteger(sessionVersion)) return null;
  return { userId, sessionVersion };
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  useSecureCookies: secureCookiesFor(process.env.NEXTAUTH_URL),
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      // next-auth hands authorize the request's headers only (from next/headers, not the Request),
      // so the address is read from them, trusting forwarded entries only as far as TRUST_PROXY says.
      authorize: (credentials, request) => authorizeCredentials(credentials, clientAddress(request?.headers)),
    }),
  ],
  events: {
    // Clearing the cookie only forgets this browser's copy; raising the version ends every copy.
    async signOut({ token }) {
      const claims = token ? claimsOf(token) : null;
      if (claims) await endSession(claims);
    },
  },
  callbacks: {
    // The token carries the user id and session version; organisation and role are read fresh
    // on every request, and so is whether the session has been ended.
    jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.sv = (user as SignedInUser).sessionVersion;
      }
      return token;
    },
    session({ session, token }) {
      if (session.user) Object.assign(session.user, { id: token.sub, sessionVersion: token.sv });
      return session;
    },
  },
};
