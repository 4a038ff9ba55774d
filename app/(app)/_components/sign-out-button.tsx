"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => void signOut({ callbackUrl: "/sign-in" })}
      className="rounded-md px-2 py-1 text-sm text-white/70 hover:bg-white/8 hover:text-white"
    >
      Sign out
    </button>
  );
}
