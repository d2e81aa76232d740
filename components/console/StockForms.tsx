"use client";

import { useRouter } from "next/navigation";
import type { InputHTMLAttributes } from "react";
import { addStockAction, adjustStockAction } from "@/app/console/stock/actions";
import { ActionMessage, FieldError, useConsoleForm } from "./useConsoleForm";

const input = "rounded border border-scale-300 px-2 py-1.5";

function Field({
  name,
  label,
  error,
  ...rest
}: { name: string; label: string; error?: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className="grid gap-1">
      {label}
      <input name={name} className={input} {...rest} />
      <FieldError message={error} />
    </label>
  );
}

/** Add full sheets or a remnant to the racks. */
export function AddStockForm({ grades }: { grades: string[] }) {
  const router = useRouter();
  const form = useConsoleForm(addStockAction, { onSuccess: () => router.refresh(), resetOnSuccess: true });
  const shown = ["kind", "grade", "thicknessMm", "lengthMm", "widthMm", "quantity", "location"];
  return (
    <section className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">Add stock</h2>
      <form onSubmit={form.onSubmit} className="mt-3 grid grid-cols-2 gap-3 text-sm" noValidate>
        <label className="grid gap-1">
          Kind
          <select name="kind" className={input} defaultValue="sheet">
            <option value="sheet">Full sheet</option>
            <option value="remnant">Remnant</option>
          </select>
        </label>
        <label className="grid gap-1">
          Grade
          <select name="grade" className={input}>
            {grades.map((g) => (
              <option key={g}>{g}</option>
            ))}
          </select>
        </label>
        <Field name="thicknessMm" label="Thickness (mm)" inputMode="decimal" error={form.error("thicknessMm")} />
        <Field name="quantity" label="Quantity" inputMode="numeric" error={form.error("quantity")} />
        <Field name="lengthMm" label="Length (mm)" inputMode="decimal" error={form.error("lengthMm")} />
        <Field name="widthMm" label="Width (mm)" inputMode="decimal" error={form.error("widthMm")} />
        <Field name="location" label="Location" placeholder="Rack B2" error={form.error("location")} />
        <button
          disabled={form.disabled}
          className="col-span-2 justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60"
        >
          Add stock
        </button>
      </form>
      <div className="mt-2">
        <ActionMessage result={form.result} shownFields={shown} success="Stock added." />
      </div>
    </section>
  );
}

/** Correct one item's count, with the reason. */
export function AdjustStockForm({ id, label }: { id: string; label: string }) {
  const router = useRouter();
  const form = useConsoleForm(adjustStockAction, { onSuccess: () => router.refresh(), resetOnSuccess: true });
  return (
    <form onSubmit={form.onSubmit} className="flex min-w-56 flex-wrap items-start gap-1 text-xs" noValidate>
      <input type="hidden" name="id" value={id} />
      <input name="delta" aria-label={`Change for ${label}`} placeholder="±n" className={`${input} w-14 py-0.5`} />
      <input name="reason" aria-label={`Reason for ${label}`} placeholder="reason" className={`${input} w-28 py-0.5`} />
      <button disabled={form.disabled} className="rounded border border-scale-300 px-2 py-0.5">
        Adjust
      </button>
      <ActionMessage result={form.result} />
    </form>
  );
}
