"use client";

import { acceptAction } from "@/app/invite/[token]/actions";
import { ActionMessage, FieldError, useConsoleForm } from "./useConsoleForm";

export function AcceptInvite({ token, email }: { token: string; email: string }) {
  const form = useConsoleForm(acceptAction);
  return (
    <form onSubmit={form.onSubmit} noValidate className="mt-6 grid gap-3 text-sm">
      <input type="hidden" name="token" value={token} />
      <p>
        Signing in as <span className="font-mono">{email}</span>.
      </p>
      <label className="grid gap-1">
        Your name
        <input name="name" required maxLength={100} className="rounded border border-scale-300 px-2 py-1.5" />
        <FieldError message={form.error("name")} />
      </label>
      <label className="grid gap-1">
        Choose a password (10 characters or more)
        <input
          name="password"
          type="password"
          minLength={10}
          required
          autoComplete="new-password"
          className="rounded border border-scale-300 px-2 py-1.5"
        />
        <FieldError message={form.error("password")} />
      </label>
      <ActionMessage result={form.result} shownFields={["name", "password"]} />
      <button
        disabled={form.disabled}
        className="rounded-md bg-ink px-3 py-2 font-medium text-scale-50 disabled:opacity-60"
      >
        Join and sign in
      </button>
    </form>
  );
}
