import { NextResponse, type NextRequest } from "next/server";

// A convenience only: sends people without a session cookie to the sign-in page before rendering.
// Every page and handler still checks the session and role itself (requireRole / route()).
const COOKIE_NAMES = ["trailbin_session", "__Host-trailbin_session"];

export function proxy(request: NextRequest) {
  const hasCookie = COOKIE_NAMES.some((n) => request.cookies.has(n));
  if (hasCookie) return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = `?next=${encodeURIComponent(request.nextUrl.pathname + request.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  // Pages only: API routes answer 401 JSON themselves; static files and the sign-in page stay open.
  matcher: ["/((?!api/|_next/|sign-in|set-password|forgot-password|favicon.ico|.*\\.(?:png|jpg|svg|woff2|ico)$).*)"],
};
