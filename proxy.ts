import { NextResponse, type NextRequest } from "next/server";
import { PAGE_ACCESS } from "@/lib/auth/routes";
import { newNonce, pageCsp } from "@/lib/security/csp";

// Two jobs before a page renders. A convenience: people without a session cookie go to the sign-in
// page (every page and handler still checks the session and role itself: requireRole / route()).
// And the page's Content-Security-Policy with a fresh nonce, which Next reads back from the request
// headers to put on its own scripts; that is why every page renders dynamically (app/layout.tsx).
const COOKIE_NAMES = ["trailbin_session", "__Host-trailbin_session"];
const PUBLIC_PAGES = new Set(Object.entries(PAGE_ACCESS).filter(([, access]) => access === "public").map(([path]) => path));

export function proxy(request: NextRequest) {
  const csp = pageCsp(newNonce(), process.env.NODE_ENV === "development");
  const { pathname, search } = request.nextUrl;
  const hasCookie = COOKIE_NAMES.some((n) => request.cookies.has(n));
  if (!hasCookie && !PUBLIC_PAGES.has(pathname)) {
    const url = request.nextUrl.clone();
    url.pathname = "/sign-in";
    url.search = `?next=${encodeURIComponent(pathname + search)}`;
    const res = NextResponse.redirect(url);
    res.headers.set("Content-Security-Policy", csp);
    return res;
  }
  // Replaces whatever CSP header the browser sent: only ours may name the nonce Next uses.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("Content-Security-Policy", csp);
  requestHeaders.delete("Content-Security-Policy-Report-Only");
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  res.headers.set("Content-Security-Policy", csp);
  return res;
}

export const config = {
  // Pages only: API routes answer 401 JSON themselves and get their headers from next.config.mjs;
  // Next's own static files and the favicon need neither a session nor a nonce.
  matcher: ["/((?!api/|_next/|favicon.ico|.*\\.(?:png|jpg|svg|woff2|ico)$).*)"],
};
