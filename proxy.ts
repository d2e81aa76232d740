import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";
import { contentSecurityPolicy, SECURITY_HEADERS } from "./lib/security-headers";

/**
 * Every page request passes here first: the browser security headers (a Content-Security-
 * Policy with a fresh nonce per page, no framing, no sniffing, no referrer beyond this site)
 * and sign-in for `/console`. Roles, and whether a session was ended on the server, are
 * checked by each page, action and feed. The API (`/api/`) does not pass here: the proxy
 * would buffer request bodies whole; the API's route wrapper sets the same headers. Methods
 * nothing serves (TRACE and the like) are refused before Next, in scripts/web-server.ts.
 */

function secure(response: NextResponse, csp: string | null): NextResponse {
  if (csp) response.headers.set("Content-Security-Policy", csp);
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) response.headers.set(name, value);
  return response;
}

export async function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;
  const nonce = pathname.startsWith("/_next/") ? null : Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = nonce ? contentSecurityPolicy(nonce, process.env.NODE_ENV === "development") : null;

  if (pathname === "/console" || pathname.startsWith("/console/")) {
    const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
    if (!token) {
      const url = new URL("/signin", request.url);
      url.searchParams.set("callbackUrl", request.nextUrl.pathname + request.nextUrl.search);
      return secure(NextResponse.redirect(url), csp);
    }
  }
  if (!nonce || !csp) return secure(NextResponse.next(), null);
  // Next reads the policy from the request to put the nonce on its own scripts; /docs reads x-nonce.
  const headers = new Headers(request.headers);
  headers.set("x-nonce", nonce);
  headers.set("Content-Security-Policy", csp);
  return secure(NextResponse.next({ request: { headers } }), csp);
}

// Everything but the API (see above).
export const config = { matcher: ["/((?!api/).*)"] };
