"use client";

import { useRouter } from "next/navigation";
import { cancelAction, releaseAction } from "@/app/console/programs/actions";
import { ActionForm } from "./ActionForm";
import { ActionMessage, useConsoleForm } from "./useConsoleForm";

export function ProgramActions({ id, canRelease, canCancel, warnings }: { id: string; canRelease: boolean; canCancel: boolean; warnings: string[] }) {
  const router = useRouter();
  const release = useConsoleForm(releaseAction, { onSuccess: () => router.refresh() });
  return (
    <div className="space-y-2">
      {canRelease && (
        <form onSubmit={release.onSubmit} className="space-y-2">
          <input type="hidden" name="id" value={id} />
          {warnings.map((w) => (
            <label key={w} className="flex items-center gap-2 text-sm">
              <input type="checkbox" name="acknowledge" value={w} required /> I have read the <code>{w}</code> warning
            </label>
          ))}
          <button disabled={release.pending} className="rounded-md bg-edge px-3 py-1.5 text-sm font-medium text-white hover:bg-edge-dark disabled:opacity-60">Release to the shear</button>
          <ActionMessage result={release.result} />
        </form>
      )}
      {canCancel && (
        <ActionForm action={cancelAction} fields={{ id }} confirm="Cancel this program? The gateway stops at its next report."
          buttonClassName="rounded-md border border-fault/50 px-3 py-1.5 text-sm text-fault hover:bg-fault-light">Cancel program</ActionForm>
      )}
    </div>
  );
}
