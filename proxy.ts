import { NextResponse, type NextRequest } from "next/server";

// Tells server components which page was asked for, so requireViewer() can send a signed-out
// visitor to /sign-in?next=<that page>. Nothing else happens here: access is checked where the
// data is read (server/auth/guard.ts), never in this file.
export function proxy(request: NextRequest) {
  const headers = new Headers(request.headers);
  headers.set("x-sealpitch-path", request.nextUrl.pathname + request.nextUrl.search);
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ["/((?!api/|_next/static|_next/image|favicon|sealpitch-mark).*)"],
};
