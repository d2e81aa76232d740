"use client";

/**
 * Console forms call their server action through this hook: the form is submitted without
 * a page load and is never reset by React, so a refused form keeps everything that was
 * typed; field errors from the schema or the service come back by field name.
 */
import { useAction } from "next-safe-action/hooks";
import type { FormEvent } from "react";
import type { ActionProblem } from "@/lib/auth/action";
import { useHydrated } from "../ui/useHydrated";

type Flattened = { formErrors?: string[]; fieldErrors?: Record<string, string[] | undefined> };

export interface ConsoleResult<Data> {
  data?: Data;
  serverError?: ActionProblem;
  validationErrors?: Flattened;
}

// The action's input is FormData for every form here; its result carries our problem shape.
type FormAction<Data> = (input: FormData) => Promise<ConsoleResult<Data> | undefined>;

export function useConsoleForm<Data>(
  action: FormAction<Data>,
  opts: { onSuccess?: (data: Data) => void; resetOnSuccess?: boolean } = {},
) {
  const { executeAsync, result, isPending } = useAction(
    action as never,
    {
      onSuccess: ({ data }: { data: Data }) => opts.onSuccess?.(data),
    } as never,
  ) as unknown as {
    executeAsync: (input: FormData) => Promise<ConsoleResult<Data> | undefined>;
    result: ConsoleResult<Data>;
    isPending: boolean;
  };
  const hydrated = useHydrated();
  const onSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const outcome = await executeAsync(new FormData(form));
    const succeeded = outcome?.data !== undefined && !outcome.serverError && !outcome.validationErrors;
    if (succeeded && opts.resetOnSuccess) form.reset();
  };
  /** The first error for a field, from the schema or from the service. */
  const error = (field: string): string | undefined =>
    result.validationErrors?.fieldErrors?.[field]?.[0] ?? result.serverError?.fieldErrors?.[field];
  // `disabled` for the form's button: while the action runs, and until the page's scripts run (useHydrated)
  return { onSubmit, result, pending: isPending, disabled: isPending || !hydrated, error };
}

/** The form's outcome: a problem (with every field error not shown beside its field), or a success message. */
export function ActionMessage({
  result,
  shownFields = [],
  success,
}: {
  result: ConsoleResult<unknown>;
  shownFields?: string[];
  success?: string;
}) {
  const problem = result.serverError;
  const formErrors = result.validationErrors?.formErrors ?? [];
  const fieldErrors = {
    ...Object.fromEntries(
      Object.entries(result.validationErrors?.fieldErrors ?? {}).map(([field, messages]) => [
        field,
        messages?.[0] ?? "",
      ]),
    ),
    ...(problem?.fieldErrors ?? {}),
  };
  const others = Object.entries(fieldErrors).filter(([field, message]) => message && !shownFields.includes(field));
  if (problem || formErrors.length || others.length) {
    return (
      <div role="alert" className="text-sm text-fault">
        {problem?.message && <p>{problem.message}</p>}
        {!problem?.message && <p>Some fields need attention.</p>}
        {(formErrors.length > 0 || others.length > 0) && (
          <ul className="mt-1 list-disc pl-5 text-xs">
            {formErrors.map((m) => (
              <li key={m}>{m}</li>
            ))}
            {others.map(([field, message]) => (
              <li key={field}>
                <span className="font-mono">{field}</span>: {message}
              </li>
            ))}
          </ul>
        )}
      </div>
    );
  }
  const message = success ?? (result.data as { message?: string } | undefined)?.message;
  return result.data !== undefined && message ? (
    <p role="status" className="text-sm text-ok">
      {message}
    </p>
  ) : null;
}

/** An error shown beside its field. */
export function FieldError({ id, message }: { id?: string; message?: string }) {
  return message ? (
    <span id={id} role="alert" className="text-xs text-fault">
      {message}
    </span>
  ) : null;
}
