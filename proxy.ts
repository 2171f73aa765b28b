import { withAuth, type NextRequestWithAuth } from "next-auth/middleware";
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { decodeSessionToken } from "@/lib/auth/session-token";
import { contentSecurityPolicy } from "@/lib/security/content-security-policy";

/** Pages anyone may open; every other page needs a session. */
const PUBLIC_PAGES = /^\/(signin|register|invite|forgot-password|reset-password|library|published)(\/|$)/;

/** A redirect to the sign-in page for a visitor without a session; nothing when there is one. */
const requireSession = withAuth({ pages: { signIn: "/signin" }, jwt: { decode: decodeSessionToken } });

/**
 * Every page passes here. Signed-out visitors to signed-in pages go to the sign-in page (a
 * first line only: every page, route handler and server action still checks the session
 * itself), and each page gets a Content-Security-Policy with a nonce of its own, which Next
 * reads from the request and puts on the scripts it writes into the page.
 */
export default async function proxy(request: NextRequest, event: NextFetchEvent): Promise<Response> {
  if (!PUBLIC_PAGES.test(request.nextUrl.pathname)) {
    const refusal = await requireSession(request as NextRequestWithAuth, event);
    if (refusal) return refusal;
  }
  const nonce = btoa(crypto.randomUUID());
  const policy = contentSecurityPolicy({ storageEndpoint: process.env.S3_ENDPOINT, development: process.env.NODE_ENV === "development", nonce });
  const headers = new Headers(request.headers);
  headers.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("content-security-policy", policy);
  return response;
}

export const config = {
  matcher: ["/((?!api|_next/static|_next/image|favicon.ico|robots.txt|fonts).*)"],
};
