import { NextResponse, type NextRequest } from "next/server";

// Pages decide about sessions themselves (requireRole), so that every refused visit, with or without
// a cookie, reaches the audit log; this proxy only adds what every response needs.
export function proxy(_request: NextRequest) {
  return NextResponse.next();
}

export const config = {
  // Pages only: API routes answer 401 JSON themselves; static files and the sign-in page stay open.
  matcher: ["/((?!api/|_next/|sign-in|set-password|forgot-password|favicon.ico|.*\\.(?:png|jpg|svg|woff2|ico)$).*)"],
};
