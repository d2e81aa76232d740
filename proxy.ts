import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";

/** The console needs a signed-in session; everything else passes. Roles are checked by each page and action. */
export async function proxy(request: NextRequest) {
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (!token) {
    const url = new URL("/signin", request.url);
    url.searchParams.set("callbackUrl", request.nextUrl.pathname + request.nextUrl.search);
    return NextResponse.redirect(url);
  }
  return NextResponse.next();
}

export const config = { matcher: ["/console/:path*"] };
