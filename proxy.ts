/**
 * Next 16 "proxy" (formerly middleware): sends signed-out visitors of app pages to /sign-in.
 * It is only a convenience: every page, action and route still checks the actor itself.
 * Left open: /api/v1 (own auth: session or token), /api/health, /api/auth, /sign-in,
 * /invite/*, /reset/*, /dev/mail and static files.
 */
import { withAuth } from "next-auth/middleware";
import { env } from "@/lib/config/env";
import { sessionCookieName } from "@/lib/auth/options";

export default withAuth({
  // Getters: the environment is read per request, not when the build evaluates this module.
  get secret() {
    return env().NEXTAUTH_SECRET;
  },
  cookies: {
    sessionToken: {
      get name() {
        return sessionCookieName();
      },
    },
  },
  pages: { signIn: "/sign-in" },
  callbacks: {
    authorized: ({ token }) => typeof token?.userId === "string",
  },
});

export const config = {
  matcher: [
    "/((?!api/v1|api/health|api/auth|sign-in|invite|reset|dev/mail|_next/static|_next/image|favicon\\.ico|icon\\.svg|fonts/|.*\\.(?:png|jpg|jpeg|gif|svg|webp|ico|woff2?|css|js|map|txt)$).*)",
  ],
};
