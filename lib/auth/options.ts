import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { clientAddress } from "./client-address";
import { authorizeCredentials } from "./credentials";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
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
  callbacks: {
    // The token carries only the user id; organisation and role are read fresh on every request.
    jwt({ token, user }) {
      if (user) token.sub = user.id;
      return token;
    },
    session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
  },
};
