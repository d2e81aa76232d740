"use client";

import { useActionState, useState } from "react";
import { createKeyAction, type KeyState } from "@/app/console/keys/actions";

export function KeyForm({ scopes, shears }: { scopes: readonly string[]; shears: { id: string; name: string }[] }) {
  const [state, act, pending] = useActionState<KeyState, FormData>(createKeyAction, null);
  const [copied, setCopied] = useState(false);
  return (
    <div className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">New API key</h2>
      {state?.secret ? (
        <div className="mt-3 space-y-2" data-testid="new-key">
          <p className="text-sm">Copy the key now. It is shown this once; Shearwire keeps only a digest of it.</p>
          <div className="flex items-center gap-2">
            <code data-testid="secret" className="flex-1 break-all rounded bg-scale-100 px-2 py-1.5 text-xs">{state.secret}</code>
            <button type="button" onClick={async () => { await navigator.clipboard?.writeText(state.secret!); setCopied(true); }}
              className="rounded border border-scale-300 px-2 py-1 text-xs">{copied ? "Copied" : "Copy"}</button>
          </div>
          <a href="/console/keys" className="text-sm text-edge hover:underline">Done</a>
        </div>
      ) : (
        <form action={act} className="mt-3 grid gap-3 text-sm">
          <label className="grid gap-1">Name <input name="name" required maxLength={100} placeholder="ERP integration" className="rounded border border-scale-300 px-2 py-1.5" /></label>
          <fieldset className="grid grid-cols-2 gap-1">
            <legend className="mb-1">Scopes</legend>
            {scopes.map((s) => (
              <label key={s} className="flex items-center gap-1.5 font-mono text-xs"><input type="checkbox" name="scopes" value={s} /> {s}</label>
            ))}
          </fieldset>
          <label className="grid gap-1">Only for these shears (gateway keys; none = all)
            <select name="shears" multiple className="rounded border border-scale-300 px-2 py-1">
              {shears.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
            </select>
          </label>
          <label className="grid gap-1">Expires (optional) <input type="date" name="expires" className="rounded border border-scale-300 px-2 py-1.5" /></label>
          {state?.error && <p role="alert" className="text-fault">{state.error}</p>}
          <button disabled={pending} className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60">Create key</button>
        </form>
      )}
    </div>
  );
}
