import { NextResponse, type NextRequest } from "next/server";
import { API_CONTENT_SECURITY_POLICY, SECURITY_HEADERS } from "@/server/http/security-headers";

export { API_CONTENT_SECURITY_POLICY, SECURITY_HEADERS };

// The HTTP edge of every page (route handlers under /api/ do not pass through here, see below).
//  - Security headers (a per-request nonce Content-Security-Policy, no framing, no sniffing, a strict
//    referrer and a Permissions-Policy that turns off every device API). The header values live in
//    server/http/security-headers.ts; next.config.ts puts the same ones, with the API policy, on
//    every /api/ response.
//  - Tells server components which page was asked for, so requireViewer() can send a signed-out
//    visitor to /sign-in?next=<that page>. Access itself is checked where the data is read
//    (server/auth/guard.ts), never in this file.
//
// The nonce follows Next.js's CSP guide: a fresh random nonce per request goes into the request's
// own Content-Security-Policy header (Next reads it there and puts it on the framework's <script>
// tags) and into `x-nonce`; the root layout reads the headers, so every page renders dynamically
// with its own nonce. 'strict-dynamic' lets those nonced scripts load the app's chunks.
//
// style-src: <style> elements and stylesheets need 'self' or the nonce, but style *attributes* are
// allowed with 'unsafe-inline' in style-src-attr only. React server-renders `style={…}` props as
// attributes (Konva's stage container, chart and bar widths), and a nonce cannot be put on an
// attribute. An attribute can set CSS properties of its own element only: it cannot load a
// stylesheet, hold selectors or run script, so the CSS-injection attacks a CSP guards against
// (selector-based exfiltration, imported sheets) stay blocked by the nonce on <style>. Konva and
// React's client updates set styles through the CSSOM, which CSP does not restrict.

/** The policy of an HTML page; `development` adds what `next dev` needs (eval for React's debug info, HMR socket). */
export function pageContentSecurityPolicy(nonce: string, development = false): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ""}`,
    `style-src 'self' 'nonce-${nonce}'`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src 'self'${development ? " ws: wss:" : ""}`,
    // The Layout desk's pattern search runs in a module worker loaded from the app (Suggest pattern).
    "worker-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

// Each request gets an id: the caller's X-Request-Id when it looks like one, else a new one, passed on
// to the route (whose log line carries it, server/log/with-logging.ts) and returned in the response.
// The proxy cannot log the request itself: the final status is known only after the route has run.
const REQUEST_ID = /^[A-Za-z0-9._:-]{8,80}$/;

export function proxy(request: NextRequest) {
  const headers = new Headers(request.headers);
  const incoming = request.headers.get("x-request-id");
  const requestId = incoming && REQUEST_ID.test(incoming) ? incoming : crypto.randomUUID();
  headers.set("x-request-id", requestId);
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(18))).toString("base64");
  const policy = pageContentSecurityPolicy(nonce, process.env.NODE_ENV === "development");
  headers.set("x-nonce", nonce);
  headers.set("content-security-policy", policy);
  headers.set("x-sealpitch-path", request.nextUrl.pathname + request.nextUrl.search);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("content-security-policy", policy);
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) response.headers.set(name, value);
  response.headers.set("x-request-id", requestId);
  return response;
}

export const config = {
  // Everything except the build's hashed static files (scripts, CSS, fonts), which carry no
  // document and are served with their exact content types, and the route handlers under /api/.
  // Those get their (fixed) headers from next.config.ts and their request id from withRequestLog
  // (server/log/with-logging.ts): running the proxy cost each API request a copy of the request
  // and its headers, the largest fixed cost the CPU profile showed on /api/health (issue #17).
  matcher: ["/((?!_next/static|_next/image|api/).*)"],
};
