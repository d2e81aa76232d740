"use client";

import { useRouter } from "next/navigation";
import { writeProgramsAction } from "@/app/console/plans/actions";
import { ActionMessage, useConsoleForm } from "./useConsoleForm";

export function WritePrograms({
  plan,
  defaultPrefix,
  patterns,
}: {
  plan: string;
  defaultPrefix: string;
  patterns: number;
}) {
  const router = useRouter();
  const form = useConsoleForm(writeProgramsAction, { onSuccess: () => router.refresh() });
  return (
    <form onSubmit={form.onSubmit} className="grid gap-2 rounded-md border border-scale-200 bg-white p-4 text-sm">
      <input type="hidden" name="plan" value={plan} />
      <label className="grid gap-1">
        Program references start with
        <input
          name="prefix"
          defaultValue={defaultPrefix}
          maxLength={90}
          className="rounded border border-scale-300 px-2 py-1.5 font-mono text-xs"
        />
      </label>
      <button
        disabled={form.disabled}
        className="rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 disabled:opacity-60"
      >
        {form.pending ? "Writing…" : `Write ${patterns} draft program${patterns === 1 ? "" : "s"}`}
      </button>
      <p className="text-xs text-ink-muted">
        Each is checked like any program and stored as a draft; release them from the program pages.
      </p>
      <ActionMessage result={form.result} />
    </form>
  );
}
