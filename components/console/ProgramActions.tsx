"use client";

import { useRouter } from "next/navigation";
import { cancelAction, releaseAction } from "@/app/console/programs/actions";
import { ActionForm } from "./ActionForm";
import { ActionMessage, useConsoleForm } from "./useConsoleForm";

/**
 * Release (asking first, naming the shear the program goes to) and cancel. A program with
 * errors cannot be released: it says how many and what to do instead of hiding the button.
 */
export function ProgramActions({
  id,
  reference,
  shearName,
  status,
  errors,
  canCancel,
  warnings,
}: {
  id: string;
  reference: string;
  shearName: string;
  status: string;
  errors: number;
  canCancel: boolean;
  warnings: { code: string; message: string }[];
}) {
  const router = useRouter();
  const release = useConsoleForm(releaseAction, { onSuccess: () => router.refresh() });
  return (
    <div className="space-y-2">
      {status === "draft" && errors > 0 && (
        <div data-testid="release-blocked" className="space-y-1 text-sm">
          <button
            disabled
            aria-describedby="release-why"
            className="cursor-not-allowed rounded-md bg-scale-200 px-3 py-1.5 text-sm font-medium text-ink-muted"
          >
            Release to the shear
          </button>
          <p id="release-why" className="text-fault">
            Fix {errors} error{errors === 1 ? "" : "s"} to release: each finding of severity error says what is over the
            limit. Change the program with <code>PATCH /api/v1/programs/{id}</code> (or upload a corrected version under
            a new reference) and it is checked again.
          </p>
        </div>
      )}
      {status === "draft" && errors === 0 && (
        <form
          onSubmit={(event) => {
            if (
              !window.confirm(
                `Release ${reference} to ${shearName}? The gateway beside ${shearName} can claim it and start cutting at once.`,
              )
            ) {
              event.preventDefault();
              return;
            }
            release.onSubmit(event);
          }}
          className="space-y-2"
        >
          <input type="hidden" name="id" value={id} />
          {warnings.map((warning) => (
            <label key={warning.code} className="flex items-start gap-2 text-sm">
              <input type="checkbox" name="acknowledge" value={warning.code} required className="mt-1" />{" "}
              <span>I have read this warning: {warning.message}</span>
            </label>
          ))}
          <button
            disabled={release.disabled}
            className="rounded-md bg-edge px-3 py-1.5 text-sm font-medium text-white hover:bg-edge-dark disabled:opacity-60"
          >
            Release to {shearName}
          </button>
        </form>
      )}
      {/* Outside the draft-only form: the refreshed page (now released) keeps the message. */}
      <ActionMessage result={release.result} />
      {canCancel && (
        <ActionForm
          action={cancelAction}
          fields={{ id }}
          confirm={`Cancel ${reference}? A gateway running it stops at its next report.`}
          buttonClassName="rounded-md border border-fault/50 px-3 py-1.5 text-sm text-fault hover:bg-fault-light"
        >
          Cancel program
        </ActionForm>
      )}
    </div>
  );
}
