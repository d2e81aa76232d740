"use client";

import { signOut } from "next-auth/react";

export function SignOut() {
  return (
    <button onClick={() => signOut({ callbackUrl: "/signin" })} className="text-xs text-ink-muted hover:text-ink">
      Sign out
    </button>
  );
}
