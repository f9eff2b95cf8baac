import NextAuth from "next-auth";
import { secureApiResponse } from "@/lib/api/handler";
import { authOptions } from "@/lib/auth/options";

const handler = NextAuth(authOptions);

// The session answers carry the member's name and e-mail: the same headers as every API answer.
async function secured(...args: Parameters<typeof handler>): Promise<Response> {
  return secureApiResponse(await handler(...args));
}

export { secured as GET, secured as POST };
