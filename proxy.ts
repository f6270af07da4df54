import { NextResponse, type NextRequest } from "next/server";
import securityHeaders from "@/lib/security-headers.json";

/**
 * Sets the security headers on every page, with a fresh nonce for the page's scripts.
 * Not an authorization layer: pages, actions and route handlers check the session themselves.
 *
 * The API does not come through here (see `config` below): its headers are fixed and set in next.config.mjs.
 * A nonce means nothing to a JSON answer, and running the proxy costs every API request a request object, a
 * copy of its headers and, for a request with a body, a copy of the body that the handler then waits for.
 */
export function proxy(request: NextRequest) {
  const malformed = malformedPathResponse(request);
  if (malformed) return withSecurityHeaders(malformed, request, securityHeaders.nonPagePolicy);
  // An API address with a percent-escape that decodes: nothing to add.
  if (request.nextUrl.pathname.startsWith("/api/")) return NextResponse.next();
  const nonce = btoa(crypto.randomUUID());
  const dev = process.env.NODE_ENV !== "production";
  const csp = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "media-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("content-security-policy", csp);
  // Lets a page send a signed-out visitor to sign-in and then back to where they were going.
  requestHeaders.set("x-pathname", request.nextUrl.pathname + request.nextUrl.search);

  return withSecurityHeaders(NextResponse.next({ request: { headers: requestHeaders } }), request, csp);
}

function withSecurityHeaders(response: NextResponse, request: NextRequest, csp: string) {
  response.headers.set("Content-Security-Policy", csp);
  response.headers.set("X-Content-Type-Options", "nosniff");
  response.headers.set("Referrer-Policy", "same-origin");
  response.headers.set("X-Frame-Options", "DENY");
  response.headers.set("Permissions-Policy", securityHeaders.permissionsPolicy);
  if (request.nextUrl.protocol === "https:") {
    response.headers.set("Strict-Transport-Security", securityHeaders.strictTransportSecurity);
  }
  return response;
}

/**
 * A path whose percent-encoding does not decode (e.g. `/api/v1/greases/%FF`) would make the router fail while
 * decoding the path parameters, which Next answers with a bare 500. Refused here with a 400 instead.
 */
function malformedPathResponse(request: NextRequest): NextResponse | null {
  const pathname = request.nextUrl.pathname;
  try {
    decodeURIComponent(pathname);
    return null;
  } catch {
    const message = "The address has broken percent-encoding.";
    if (pathname.startsWith("/api/"))
      return NextResponse.json(
        {
          error: {
            code: "malformed_path",
            message,
            fields: { path: ["Percent-encode the address as UTF-8."] },
          },
        },
        { status: 400 },
      );
    return new NextResponse(message, {
      status: 400,
      headers: { "Content-Type": "text/plain; charset=utf-8" },
    });
  }
}

export const config = {
  matcher: [
    // Pages, server actions and files, except the framework's static files.
    { source: "/((?!api/|_next/static|_next/image|favicon.ico).*)" },
    // The API only when its address holds a percent-escape, so one that does not decode is refused above.
    { source: "/api/:rest(.*%.*)" },
  ],
};
