"use client";

import { useActionState } from "react";
import { programAction, type ActionState } from "@/app/console/programs/actions";
import { ConfirmButton } from "@/components/ui/ConfirmButton";

export function ProgramActions({ id, canRelease, canCancel, warnings }: { id: string; canRelease: boolean; canCancel: boolean; warnings: string[] }) {
  const [state, act, pending] = useActionState<ActionState, FormData>(programAction, null);
  return (
    <div className="space-y-2">
      {canRelease && (
        <form action={act} className="space-y-2">
          <input type="hidden" name="id" value={id} />
          <input type="hidden" name="action" value="release" />
          {warnings.map((w) => (
            <label key={w} className="flex items-center gap-2 text-sm">
              <input type="checkbox" name="acknowledge" value={w} required /> I have read the <code>{w}</code> warning
            </label>
          ))}
          <button disabled={pending} className="rounded-md bg-edge px-3 py-1.5 text-sm font-medium text-white hover:bg-edge-dark disabled:opacity-60">Release to the shear</button>
        </form>
      )}
      {canCancel && (
        <form action={act}>
          <input type="hidden" name="id" value={id} />
          <input type="hidden" name="action" value="cancel" />
          <ConfirmButton question="Cancel this program? The gateway stops at its next report." className="rounded-md border border-fault/50 px-3 py-1.5 text-sm text-fault hover:bg-fault-light">Cancel program</ConfirmButton>
        </form>
      )}
      {state?.ok && <p role="status" className="text-sm text-ok">{state.ok}</p>}
      {state?.error && <p role="alert" className="text-sm text-fault">{state.error}</p>}
    </div>
  );
}
