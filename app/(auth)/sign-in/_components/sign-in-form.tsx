"use client";

import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

export interface DemoSignIn {
  role: string;
  email: string;
  password: string;
}

/** Turns next-auth's error string into a sentence for the person signing in. */
function describeSignInError(error: string): string {
  if (error.startsWith("too_many_requests") || /too many/i.test(error)) {
    return "Too many failed sign-ins for this e-mail or address. Wait a few minutes and try again.";
  }
  return "The e-mail or password is not right.";
}

export function SignInForm({ demo, callbackUrl, initialEmail }: { demo: DemoSignIn[] | null; callbackUrl: string; initialEmail: string }) {
  const router = useRouter();
  const [email, setEmail] = useState(initialEmail);
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setPending(true);
    setError(null);
    const res = await signIn("credentials", { email, password, redirect: false });
    if (!res || res.error || !res.ok) {
      setPending(false);
      setError(describeSignInError(res?.error ?? ""));
      return;
    }
    router.replace(callbackUrl);
    router.refresh();
  }

  return (
    <div className="space-y-4">
      <form onSubmit={submit} className="space-y-4 rounded-lg border border-line bg-surface p-5 shadow-sm" noValidate>
        <h1 className="text-base font-semibold">Sign in</h1>
        {error ? <Notice tone="error">{error}</Notice> : null}
        <TextField
          label="E-mail"
          name="email"
          type="email"
          autoComplete="username"
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          required
        />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          required
        />
        <Button type="submit" variant="primary" className="w-full" disabled={pending}>
          {pending ? "Signing in…" : "Sign in"}
        </Button>
        <p className="text-center text-xs">
          <Link href="/reset" className="text-accent hover:underline">
            Forgot your password?
          </Link>
        </p>
      </form>
      {demo && demo.length > 0 ? (
        <section className="rounded-lg border border-dashed border-line-strong bg-sunken/60 p-4" data-testid="demo-sign-ins">
          <h2 className="mb-2 text-xs font-medium uppercase tracking-wide text-muted">Demo sign-ins</h2>
          <ul className="space-y-1.5 text-sm">
            {demo.map((d) => (
              <li key={d.email} className="flex items-center justify-between gap-2">
                <span className="flex min-w-0 items-baseline">
                  <span className="inline-block w-20 shrink-0 font-medium capitalize">{d.role}</span>
                  <span className="min-w-0 font-mono text-xs leading-5 text-muted">
                    {d.email}
                    <br />
                    {d.password}
                  </span>
                </span>
                <Button
                  size="sm"
                  variant="quiet"
                  onClick={() => {
                    setEmail(d.email);
                    setPassword(d.password);
                  }}
                >
                  Use
                </Button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
