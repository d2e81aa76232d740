"use client";

import { useRouter } from "next/navigation";
import type { ReactNode } from "react";
import { ActionMessage, useConsoleForm, type ConsoleResult } from "./useConsoleForm";

/**
 * A one-button form for a server action (revoke, archive, enable…): hidden fields, an
 * optional question before it runs, and its outcome shown beside the button.
 */
export function ActionForm({
  action,
  fields,
  children,
  confirm,
  className,
  buttonClassName,
  label,
}: {
  action: (input: FormData) => Promise<ConsoleResult<unknown> | undefined>;
  fields: Record<string, string>;
  children: ReactNode;
  /** asked before the action runs; nothing happens unless the person agrees */
  confirm?: string;
  className?: string;
  buttonClassName?: string;
  /** an accessible name for the button when its text alone repeats on the page ("Revoke key ERP-2") */
  label?: string;
}) {
  const router = useRouter();
  const form = useConsoleForm(action, { onSuccess: () => router.refresh() });
  return (
    <form
      className={className}
      onSubmit={(event) => {
        if (confirm && !window.confirm(confirm)) {
          event.preventDefault();
          return;
        }
        form.onSubmit(event);
      }}
    >
      {Object.entries(fields).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      <button disabled={form.disabled} aria-label={label} className={buttonClassName}>
        {children}
      </button>
      <ActionMessage result={form.result} />
    </form>
  );
}
