import NextAuth from "next-auth";
import { authOptions } from "@/lib/auth/options";

// Options are built per request so the environment is read at run time, not at build time.
type Ctx = { params: Promise<{ nextauth: string[] }> };

async function handler(req: Request, ctx: Ctx): Promise<Response> {
  const h: (req: Request, ctx: Ctx) => Promise<Response> = NextAuth(authOptions());
  return h(req, ctx);
}

export { handler as GET, handler as POST };
