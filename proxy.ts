import { withAuth } from "next-auth/middleware";
import { decodeSessionToken } from "@/lib/auth/session-token";

/**
 * First line only: signed-out visitors to signed-in pages go to the sign-in page.
 * Every page, route handler and server action still checks the session itself.
 */
export default withAuth({ pages: { signIn: "/signin" }, jwt: { decode: decodeSessionToken } });

export const config = {
  matcher: ["/((?!api|_next/static|_next/image|favicon.ico|robots.txt|fonts|signin|register|invite|forgot-password|reset-password|library|published).*)"],
};
