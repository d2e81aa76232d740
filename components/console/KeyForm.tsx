"use client";

import { useRef, useState } from "react";
import { createKeyAction } from "@/app/console/keys/actions";
import { ActionMessage, FieldError, useConsoleForm } from "./useConsoleForm";

export function KeyForm({
  scopes,
  words,
  presets,
  shears,
  readOnly,
}: {
  scopes: readonly string[];
  words: Record<string, string>;
  presets: { name: string; label: string; scopes: string[]; note: string }[];
  shears: { id: string; name: string }[];
  readOnly: boolean;
}) {
  const form = useConsoleForm(createKeyAction);
  const [copied, setCopied] = useState(false);
  const scopeBoxes = useRef<HTMLFieldSetElement>(null);
  const created = form.result.data;
  const choose = (preset: { scopes: string[] }) => {
    for (const box of scopeBoxes.current?.querySelectorAll<HTMLInputElement>("input[name=scopes]") ?? [])
      box.checked = preset.scopes.includes(box.value);
  };
  return (
    <div className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">New API key</h2>
      {readOnly && (
        <p className="mt-1 text-xs text-ink-muted">
          As a developer you may create read-only keys; admins and owners create the others.
        </p>
      )}
      {created?.secret ? (
        <div className="mt-3 space-y-2" data-testid="new-key">
          <p className="text-sm">Copy the key now. It is shown this once; Shearwire keeps only a digest of it.</p>
          <div className="flex items-center gap-2">
            <code data-testid="secret" className="flex-1 break-all rounded bg-scale-100 px-2 py-1.5 text-xs">
              {created.secret}
            </code>
            <button
              type="button"
              onClick={async () => {
                await navigator.clipboard?.writeText(created.secret);
                setCopied(true);
              }}
              className="rounded border border-scale-300 px-2 py-1 text-xs"
            >
              {copied ? "Copied" : "Copy"}
            </button>
          </div>
          {/* eslint-disable-next-line @next/next/no-html-link-for-pages -- a full load, so the secret leaves the page's memory */}
          <a href="/console/keys" className="text-sm text-edge hover:underline">
            Done
          </a>
        </div>
      ) : (
        <form onSubmit={form.onSubmit} className="mt-3 grid gap-3 text-sm" noValidate>
          <label className="grid gap-1">
            Name
            <input
              name="name"
              required
              maxLength={100}
              placeholder="ERP integration"
              aria-describedby="key-name-error"
              className="rounded border border-scale-300 px-2 py-1.5"
            />
            <FieldError id="key-name-error" message={form.error("name")} />
          </label>
          <div className="grid gap-1">
            <span>Start from</span>
            <div className="flex flex-wrap gap-1">
              {presets.map((preset) => (
                <button
                  key={preset.name}
                  type="button"
                  onClick={() => choose(preset)}
                  title={preset.note}
                  className="rounded border border-scale-300 px-2 py-1 text-xs hover:border-ink"
                >
                  {preset.label}
                </button>
              ))}
            </div>
          </div>
          <fieldset ref={scopeBoxes} className="grid gap-1">
            <legend className="mb-1">Scopes</legend>
            {scopes.map((scope) => (
              <label key={scope} className="flex items-start gap-1.5 text-xs">
                <input type="checkbox" name="scopes" value={scope} className="mt-0.5" />{" "}
                <span>
                  <span className="font-mono">{scope}</span> <span className="text-ink-muted">· {words[scope]}</span>
                </span>
              </label>
            ))}
            <FieldError message={form.error("scopes")} />
          </fieldset>
          {!readOnly && (
            <label className="grid gap-1">
              Only for these shears (gateway keys; none = all)
              <select name="shears" multiple className="rounded border border-scale-300 px-2 py-1">
                {shears.map((shear) => (
                  <option key={shear.id} value={shear.id}>
                    {shear.name}
                  </option>
                ))}
              </select>
              <FieldError message={form.error("shears") ?? form.error("shears.0")} />
            </label>
          )}
          <label className="grid gap-1">
            Expires (optional)
            <input type="date" name="expires" className="rounded border border-scale-300 px-2 py-1.5" />
            <FieldError message={form.error("expires")} />
          </label>
          <ActionMessage result={form.result} shownFields={["name", "scopes", "shears", "shears.0", "expires"]} />
          <button
            disabled={form.disabled}
            className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60"
          >
            Create key
          </button>
        </form>
      )}
    </div>
  );
}
