import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { connection } from "next/server";
import { getActor } from "@/lib/auth/session";
import { env } from "@/lib/config/env";
import { DEMO_SIGN_INS } from "@/db/seeds/demo-users";
import { Notice } from "@/components/ui/notice";
import { SignInForm } from "./_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

/** Only same-site paths are accepted as the place to return to after signing in. */
function safeCallback(v: string | string[] | undefined): string {
  const s = Array.isArray(v) ? v[0] : v;
  return s && s.startsWith("/") && !s.startsWith("//") ? s : "/";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await connection();
  const sp = await searchParams;
  const callbackUrl = safeCallback(sp.callbackUrl);
  if (await getActor()) redirect(callbackUrl);
  const demo = env().MODEWARDEN_DEMO ? DEMO_SIGN_INS.map((d) => ({ role: d.role, email: d.email, password: d.password })) : null;
  const email = typeof sp.email === "string" ? sp.email : "";
  return (
    <div className="space-y-3">
      {sp.invited ? <Notice tone="success">Your password is set. Sign in to continue.</Notice> : null}
      {sp.reset ? <Notice tone="success">Your password has been changed. Sign in with the new one.</Notice> : null}
      <SignInForm demo={demo} callbackUrl={callbackUrl} initialEmail={email} />
    </div>
  );
}
