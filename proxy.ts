import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";

/**
 * Only redirects signed-out visitors of app pages to the sign-in page.
 * Authorisation is never decided here: every handler and action runs the guard.
 */
export async function proxy(request: NextRequest) {
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const url = request.nextUrl.clone();
  const next = request.nextUrl.pathname + request.nextUrl.search;
  url.pathname = "/sign-in";
  url.search = next && next !== "/" ? `?next=${encodeURIComponent(next)}` : "";
  return NextResponse.redirect(url);
}

export const config = {
  // API routes answer 401 themselves; static assets, the sign-in page and the icon stay public.
  matcher: ["/((?!api|_next/static|_next/image|icon.svg|favicon.ico|sign-in).*)"],
};
