"use client";

import { useEffect, useRef } from "react";
import { planAction } from "@/app/console/plans/actions";
import { PLAN_OBJECTIVE_LABELS } from "@/lib/schemas/enums";
import { ActionMessage, useConsoleForm } from "./useConsoleForm";

const input = "rounded border border-scale-300 px-2 py-1.5";

export function PlanForm({
  shears,
  grades,
}: {
  shears: { id: string; name: string }[];
  grades: { code: string; name: string }[];
}) {
  // The form is never reset by a refusal: what was typed stays to be fixed.
  const form = useConsoleForm(planAction);
  const pending = form.pending;
  const state = form.result.data?.refused;
  const rows = useRef<HTMLTextAreaElement>(null);
  const file = useRef<HTMLInputElement>(null);
  // A refused upload's rows move into the rows box, to be fixed there.
  useEffect(() => {
    if (state?.csv !== undefined && rows.current && file.current) {
      rows.current.value = state.csv;
      file.current.value = "";
    }
  }, [state]);
  return (
    <form
      onSubmit={form.onSubmit}
      className="grid max-w-4xl gap-4 rounded-md border border-scale-200 bg-white p-4 text-sm"
    >
      <div className="grid gap-3 sm:grid-cols-3">
        <label className="grid gap-1">
          Reference <input name="reference" maxLength={80} placeholder="WK49-A36-3MM" className={input} />
        </label>
        <label className="grid gap-1 sm:col-span-2">
          Title <input name="title" maxLength={200} placeholder="Week 49, 3 mm A36" className={input} />
        </label>
        <label className="grid min-w-0 gap-1">
          Shear
          <select name="shear" className={`${input} w-full min-w-0`}>
            {shears.map((shear) => (
              <option key={shear.id} value={shear.id}>
                {shear.name}
              </option>
            ))}
            <option value="">Any shear: the shop&apos;s rule chooses</option>
          </select>
        </label>
        <label className="grid min-w-0 gap-1">
          Grade
          <select name="grade" required className={`${input} w-full min-w-0`}>
            {grades.map((grade) => (
              <option key={grade.code} value={grade.code}>
                {grade.code} · {grade.name}
              </option>
            ))}
          </select>
        </label>
        <div className="grid min-w-0 gap-1">
          <label htmlFor="plan-thickness">Thickness</label>
          <div className="flex gap-1">
            <input
              id="plan-thickness"
              name="thickness"
              required
              inputMode="decimal"
              placeholder="3"
              className={`${input} min-w-0 flex-1`}
            />
            <select name="thicknessKind" defaultValue={"value"} aria-label="The thickness is" className={input}>
              <option value="value">a size in the units</option>
              <option value="gauge">a gauge number</option>
            </select>
            <select name="units" defaultValue={"mm"} aria-label="Units of every size in the plan" className={input}>
              <option value="mm">mm</option>
              <option value="in">in</option>
            </select>
          </div>
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="grid content-start gap-2">
          <label className="grid gap-1">
            Stock on hand, in the plan&apos;s units: one size per line, <code>length, width, count</code> (leave the
            count out for as many as needed)
            <textarea
              name="stock"
              required
              rows={4}
              defaultValue={"2500, 1250, 10\n3000, 1500"}
              className={`${input} font-mono text-xs`}
            />
          </label>
          <label className="flex items-start gap-1.5 text-sm">
            <input type="checkbox" name="onHand" className="mt-1" /> Plan on the shop&apos;s stock of this grade and
            thickness instead (remnants first); writing the programs reserves the sheets they use
          </label>
        </div>
        <div className="grid gap-2">
          <label className="grid gap-1">
            Cut list (.csv), sizes in the plan&apos;s units: <code>label, length, width, quantity, can_turn</code>{" "}
            (can_turn: no when grain or finish must follow the sheet)
            <input ref={file} type="file" name="file" accept=".csv,text/csv" />
          </label>
          <label className="grid gap-1">
            …or paste its rows (with the header line)
            <textarea
              ref={rows}
              name="blanks"
              rows={4}
              placeholder={"label,length,width,quantity,can_turn\nbase,600,400,10,yes"}
              className={`${input} font-mono text-xs`}
            />
          </label>
        </div>
      </div>
      <fieldset className="grid gap-3 sm:grid-cols-4">
        <legend className="mb-1 font-semibold">Options</legend>
        <label className="grid gap-1">
          Objective
          <select name="objective" defaultValue={"fewest_sheets"} className={input}>
            {Object.entries(PLAN_OBJECTIVE_LABELS).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <label className="grid gap-1">
          Trim the first edge by (plan&apos;s units){" "}
          <input name="trim" inputMode="decimal" placeholder="0" className={input} />
        </label>
        <label className="grid gap-1">
          Over-production allowed (%){" "}
          <input name="overProductionPct" inputMode="decimal" placeholder="0" className={input} />
        </label>
        <div className="grid gap-1">
          Keep offcuts of at least (plan&apos;s units)
          <div className="flex gap-1">
            <input
              name="reusableLength"
              aria-label="Reusable offcut length"
              inputMode="decimal"
              placeholder="length"
              className={`${input} w-full`}
            />
            <input
              name="reusableWidth"
              aria-label="Reusable offcut width"
              inputMode="decimal"
              placeholder="width"
              className={`${input} w-full`}
            />
          </div>
        </div>
        <label className="flex items-center gap-1.5 sm:col-span-4">
          <input type="checkbox" name="offcutsAsStock" /> Count kept offcuts as stock returned (not waste)
        </label>
      </fieldset>
      <div className="flex items-center gap-3">
        <button
          disabled={form.disabled}
          className="rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 disabled:opacity-60"
        >
          {pending ? "Planning…" : "Plan"}
        </button>
        <span className="text-xs text-ink-muted">
          Nothing is sent to a shear: the plan is stored, and you write its draft programs from it.
        </span>
      </div>
      <ActionMessage result={form.result} />
      {state && (
        <div
          role="alert"
          className="rounded-md border border-fault/40 bg-fault-light p-3 text-sm"
          data-testid="plan-errors"
        >
          {state.message && <p className="font-semibold text-fault">{state.message}</p>}
          {!state.message && <p className="font-semibold text-fault">Nothing was planned: fix these and try again.</p>}
          <ul className="mt-1 space-y-0.5 font-mono text-xs">
            {state.errors?.map((message, index) => (
              <li key={`r${index}`}>
                row {message.row} · {message.field}: {message.message}
              </li>
            ))}
            {state.fields?.map((field, index) => (
              <li key={`f${index}`}>
                {field.field}: {field.message}
              </li>
            ))}
          </ul>
        </div>
      )}
    </form>
  );
}
