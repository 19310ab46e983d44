import { NextResponse, type NextRequest } from "next/server";
import { newNonce, pageCsp } from "@/lib/security/csp";
import { PATH_HEADER } from "@/lib/http/path-header";

// The page's Content-Security-Policy with a fresh nonce, which Next reads back from the request
// headers to put on its own scripts; that is why every page renders dynamically (app/layout.tsx).
// Sessions are not looked at here: pages decide themselves (requireRole), so that every refused
// visit, with or without a cookie, reaches the audit log.
export function proxy(request: NextRequest) {
  const csp = pageCsp(newNonce(), process.env.NODE_ENV === "development");
  // Replaces whatever CSP header the browser sent: only ours may name the nonce Next uses.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("Content-Security-Policy", csp);
  requestHeaders.delete("Content-Security-Policy-Report-Only");
  requestHeaders.set(PATH_HEADER, request.nextUrl.pathname + request.nextUrl.search);
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  res.headers.set("Content-Security-Policy", csp);
  return res;
}

export const config = {
  // Pages only: API routes answer 401 JSON themselves and get their headers from next.config.mjs;
  // Next's own static files and the favicon need neither a session nor a nonce.
  matcher: ["/((?!api/|_next/|favicon.ico|.*\\.(?:png|jpg|svg|woff2|ico)$).*)"],
};
