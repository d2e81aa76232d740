"use client";

import Link from "next/link";
import { uploadAction } from "@/app/console/upload/actions";
import { ActionMessage, useConsoleForm } from "./useConsoleForm";

export function UploadForm() {
  const form = useConsoleForm(uploadAction);
  const pending = form.pending;
  const state = form.result.data;
  return (
    <div className="space-y-4">
      <form
        onSubmit={form.onSubmit}
        className="flex items-center gap-3 rounded-md border border-scale-200 bg-white p-4 text-sm"
      >
        <label className="grid gap-1">
          Cut list (.csv) or programs (.json)
          <input type="file" name="file" accept=".csv,.json,text/csv,application/json" required />
        </label>
        <button
          disabled={form.disabled}
          className="rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 disabled:opacity-60"
        >
          {pending ? "Checking…" : "Check and import"}
        </button>
      </form>
      <ActionMessage result={form.result} success="" />
      {state?.message && (
        <p role="alert" className="text-sm text-fault">
          {state.message}
        </p>
      )}
      {state?.errors && (
        <div
          role="alert"
          className="rounded-md border border-fault/40 bg-fault-light p-4 text-sm"
          data-testid="upload-errors"
        >
          <p className="font-semibold text-fault">Nothing was imported: fix these rows and upload the file again.</p>
          <ul className="mt-2 space-y-0.5 font-mono text-xs">
            {state.errors.map((message, index) => (
              <li key={index}>
                row {message.row} · {message.field}: {message.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {state?.created && (
        <div role="status" className="rounded-md bg-ok-light p-4 text-sm text-ok" data-testid="upload-created">
          <p className="font-semibold">
            {state.created.length} draft program{state.created.length === 1 ? "" : "s"} created.
          </p>
          <ul className="mt-1">
            {state.created.map((program) => (
              <li key={program.id}>
                <Link className="underline" href={`/console/programs/${program.id}`}>
                  {program.reference}
                </Link>{" "}
                · check {program.validation}
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
