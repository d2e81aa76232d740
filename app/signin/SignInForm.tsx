"use client";

import { signIn } from "next-auth/react";
import { useRouter, useSearchParams } from "next/navigation";
import { useState, type FormEvent } from "react";
import { useHydrated } from "@/components/ui/useHydrated";
import { safeCallbackPath } from "@/lib/auth/redirect";

const NOTICES: Record<string, string> = {
  "no-shop": "Your account belongs to no shop yet.",
  "session-ended": "Your session ended (you signed out, or your access changed). Sign in again.",
};

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [error, setError] = useState<string | null>(NOTICES[params.get("error") ?? ""] ?? null);
  const [busy, setBusy] = useState(false);
  // Until the page's scripts run, the form cannot post (its action runs in the browser): the button says so by being disabled.
  const hydrated = useHydrated();

  // A submit handler, not a form action: React resets a form after its action, which emptied the e-mail a person had
  // typed after every wrong password (and could empty what they typed next while the button came back).
  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const form = new FormData(formElement);
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", {
      email: form.get("email"),
      password: form.get("password"),
      redirect: false,
    });
    // the password is cleared before the button comes back; the e-mail stays
    if (!res?.ok || res.error) (formElement.elements.namedItem("password") as HTMLInputElement).value = "";
    setBusy(false);
    // Only a path on this site is followed after signing in; anything else goes to the console.
    if (res?.ok && !res.error) router.push(safeCallbackPath(params.get("callbackUrl")));
    else if (res?.error && res.error !== "CredentialsSignin") setError(res.error);
    else setError("That e-mail and password do not match an account.");
  }

  const joined = params.get("joined");
  return (
    <form onSubmit={(event) => void submit(event)} className="mt-8 space-y-4">
      {joined && (
        <p role="status" className="rounded-md bg-ok-light px-3 py-2 text-sm text-ok">
          Welcome aboard. Sign in with your new password.
        </p>
      )}
      <label className="block text-sm font-medium">
        E-mail
        <input
          name="email"
          type="email"
          required
          autoComplete="username"
          autoFocus
          defaultValue={params.get("joined") ?? ""}
          className="mt-1 w-full rounded-md border border-scale-300 bg-white px-3 py-2"
        />
      </label>
      <label className="block text-sm font-medium">
        Password
        <input
          name="password"
          type="password"
          required
          autoComplete="current-password"
          className="mt-1 w-full rounded-md border border-scale-300 bg-white px-3 py-2"
        />
      </label>
      {error && (
        <p role="alert" className="rounded-md bg-fault-light px-3 py-2 text-sm text-fault">
          {error}
        </p>
      )}
      <button
        disabled={busy || !hydrated}
        className="w-full rounded-md bg-ink px-4 py-2 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60"
      >
        {busy ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
