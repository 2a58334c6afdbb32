import { NextResponse, type NextRequest } from "next/server";

// Runs before every page, server action and API route. It does two things and nothing else
// (access is checked where the data is read, server/auth/guard.ts):
// - tells server components which page was asked for, so requireViewer() can send a signed-out
//   visitor to /sign-in?next=<that page>;
// - gives the request its id: the caller's X-Request-Id when it looks like one, else a new one,
//   passed on to the route (whose log line carries it) and returned in the response header.
// It cannot log the request itself: the final status is only known after the route has run,
// so the route handler and server action wrappers in server/log/with-logging.ts write the line.
const REQUEST_ID = /^[A-Za-z0-9._:-]{8,80}$/;

export function proxy(request: NextRequest) {
  const incoming = request.headers.get("x-request-id");
  const requestId = incoming && REQUEST_ID.test(incoming) ? incoming : crypto.randomUUID();
  const headers = new Headers(request.headers);
  headers.set("x-request-id", requestId);
  if (!request.nextUrl.pathname.startsWith("/api/")) {
    headers.set("x-sealpitch-path", request.nextUrl.pathname + request.nextUrl.search);
  }
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("x-request-id", requestId);
  return response;
}

export const config = {
  matcher: ["/((?!api/health|api/metrics|_next/static|_next/image|favicon|sealpitch-mark).*)"],
};
