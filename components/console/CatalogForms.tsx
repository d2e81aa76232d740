"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type FieldValues, type Resolver } from "react-hook-form";
import { saveGrade, saveShear } from "@/app/console/catalog-actions";
import { GAUGE_FAMILIES, GRADE_FAMILIES } from "@/lib/schemas/enums";
import { useHydrated } from "../ui/useHydrated";
import { GAUGE_SYSTEM_WORDS } from "./words";
import { GradeInputSchema, GradePatchSchema } from "@/lib/schemas/grade";
import { ShearInputSchema, ShearPatchSchema } from "@/lib/schemas/shear";

type Field = {
  name: string;
  label: string;
  unit?: string;
  kind?: "text" | "number" | "select";
  options?: readonly string[];
  optional?: boolean;
};

const SHEAR_FIELDS: Field[] = [
  { name: "name", label: "Name", kind: "text" },
  { name: "description", label: "Description", kind: "text", optional: true },
  { name: "ratedThicknessMm", label: "Rated thickness", unit: "mm" },
  { name: "ratedTensileMpa", label: "Rated at tensile", unit: "MPa" },
  { name: "ratedRakeDeg", label: "Rated at rake", unit: "°" },
  { name: "bladeLengthMm", label: "Blade length", unit: "mm" },
  { name: "backgaugeMinMm", label: "Backgauge from", unit: "mm" },
  { name: "backgaugeMaxMm", label: "Backgauge to", unit: "mm" },
  { name: "rakeMinDeg", label: "Rake from", unit: "°" },
  { name: "rakeMaxDeg", label: "Rake to", unit: "°" },
  { name: "gapMinMm", label: "Blade gap from", unit: "mm" },
  { name: "gapMaxMm", label: "Blade gap to", unit: "mm" },
  { name: "strokesPerMin", label: "Strokes", unit: "/min" },
  { name: "backgaugeSpeedMmPerS", label: "Backgauge speed", unit: "mm/s" },
  { name: "handlingSecondsPerTurn", label: "Handling per turn", unit: "s" },
  { name: "handlingSecondsPerSheet", label: "Handling per sheet", unit: "s" },
  { name: "maxBladeHardnessHb", label: "Blades good to", unit: "HB", optional: true },
  { name: "backgaugeRepeatabilityMm", label: "Backgauge repeatability ±", unit: "mm", optional: true },
  { name: "crownAtRatedMm", label: "Crown at rated force", unit: "mm", optional: true },
  { name: "crownBaselineMm", label: "Crown with no load", unit: "mm", optional: true },
];

const GRADE_FIELDS: Field[] = [
  { name: "code", label: "Code", kind: "text" },
  { name: "name", label: "Name", kind: "text" },
  { name: "family", label: "Family", kind: "select", options: GRADE_FAMILIES },
  { name: "standard", label: "Standard", kind: "text" },
  { name: "yieldMpa", label: "Yield", unit: "MPa", optional: true },
  { name: "tensileMinMpa", label: "Tensile, minimum", unit: "MPa", optional: true },
  { name: "tensileTypicalMpa", label: "Tensile, typical", unit: "MPa", optional: true },
  { name: "tensileMaxMpa", label: "Tensile, maximum", unit: "MPa", optional: true },
  { name: "shearTensileRatio", label: "Shear / tensile", optional: true },
  { name: "gaugeFamily", label: "Gauge system", kind: "select", options: ["", ...GAUGE_FAMILIES], optional: true },
  { name: "hardnessHb", label: "Hardness", unit: "HB", optional: true },
  { name: "note", label: "Note", kind: "text", optional: true },
];

/** Empty inputs become null (optional) or undefined, numbers become numbers, before the schema sees them. */
function clean(fields: Field[], values: Record<string, unknown>, editing: boolean) {
  const out: Record<string, unknown> = {};
  for (const field of fields) {
    const value = values[field.name];
    if (value === "" || value === undefined || value === null) {
      if (field.optional)
        out[field.name] =
          field.kind === "text" && field.name !== "note" && field.name !== "description" ? undefined : null;
      else if (!editing) out[field.name] = undefined;
      continue;
    }
    out[field.name] = field.kind === "text" || field.kind === "select" ? value : Number(value);
  }
  if (editing && "code" in out) delete out.code; // a grade's code does not change
  return JSON.parse(JSON.stringify(out)) as Record<string, unknown>;
}

type CatalogState = { ok?: string; error?: string; fieldErrors?: Record<string, string> } | null;

/** What a save answered, for the form: a message, or the problem with its field errors. */
function stateOf(
  result:
    | {
        data?: { message?: string };
        serverError?: { message: string; fieldErrors?: Record<string, string> };
        validationErrors?: unknown;
      }
    | undefined,
): CatalogState {
  if (result?.serverError) return { error: result.serverError.message, fieldErrors: result.serverError.fieldErrors };
  if (result?.validationErrors) return { error: "The form could not be read; reload the page and try again." };
  return { ok: result?.data?.message ?? "Saved." };
}

function CatalogForm({
  fields,
  schema,
  initial,
  save,
  editing,
}: {
  fields: Field[];
  schema: typeof ShearInputSchema | typeof ShearPatchSchema | typeof GradeInputSchema | typeof GradePatchSchema;
  initial: Record<string, unknown>;
  save: (data: Record<string, unknown>) => Promise<Parameters<typeof stateOf>[0]>;
  editing: boolean;
}) {
  const router = useRouter();
  const hydrated = useHydrated();
  const [result, setResult] = useState<CatalogState>(null);
  const resolver: Resolver<FieldValues> = async (values, ctx, opts) =>
    (zodResolver(schema as never) as Resolver<FieldValues>)(clean(fields, values, editing), ctx, opts);
  const form = useForm<FieldValues>({
    resolver,
    defaultValues: Object.fromEntries(fields.map((f) => [f.name, initial[f.name] ?? ""])),
  });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async () => {
    const res = stateOf(await save(clean(fields, form.getValues(), editing)));
    setResult(res);
    if (res?.ok) router.refresh();
    if (res?.ok && !editing) form.reset();
  });
  return (
    <form onSubmit={onSubmit} className="grid grid-cols-2 gap-x-3 gap-y-2 text-sm" noValidate>
      {fields.map((field) => {
        const message = (errors[field.name]?.message as string | undefined) ?? result?.fieldErrors?.[field.name];
        return (
          <label
            key={field.name}
            className={`grid gap-0.5 ${field.kind === "text" && field.name !== "code" ? "col-span-2" : ""}`}
          >
            <span className="text-xs">
              {field.label}
              {field.unit ? ` (${field.unit})` : ""}
              {field.optional ? "" : " *"}
            </span>
            {field.kind === "select" ? (
              <select {...form.register(field.name)} className="rounded border border-scale-300 px-2 py-1">
                {field.options!.map((choice) => (
                  <option key={choice} value={choice}>
                    {choice
                      ? field.name === "gaugeFamily"
                        ? `${choice}: ${GAUGE_SYSTEM_WORDS[choice]}`
                        : choice
                      : "none"}
                  </option>
                ))}
              </select>
            ) : (
              <input
                {...form.register(field.name)}
                inputMode={field.kind === "text" ? undefined : "decimal"}
                disabled={editing && field.name === "code"}
                aria-invalid={message ? true : undefined}
                className="rounded border border-scale-300 px-2 py-1 aria-[invalid]:border-fault disabled:bg-scale-100"
              />
            )}
            {message && (
              <span role="alert" className="text-xs text-fault">
                {message}
              </span>
            )}
          </label>
        );
      })}
      <div className="col-span-2 flex items-center gap-3">
        <button
          disabled={form.formState.isSubmitting || !hydrated}
          className="rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 disabled:opacity-60"
        >
          {editing ? "Save changes" : "Add"}
        </button>
        {result?.ok && (
          <span role="status" className="text-ok">
            {result.ok}
          </span>
        )}
        {result?.error && !result.fieldErrors && (
          <span role="alert" className="text-fault">
            {result.error}
          </span>
        )}
      </div>
    </form>
  );
}

export function ShearForm({ id, initial = {} }: { id?: string; initial?: Record<string, unknown> }) {
  return (
    <CatalogForm
      fields={SHEAR_FIELDS}
      schema={id ? ShearPatchSchema : ShearInputSchema}
      initial={initial}
      editing={Boolean(id)}
      save={(data) => saveShear({ id: id ?? null, data })}
    />
  );
}

export function GradeForm({ id, initial = {} }: { id?: string; initial?: Record<string, unknown> }) {
  return (
    <CatalogForm
      fields={GRADE_FIELDS}
      schema={id ? GradePatchSchema : GradeInputSchema}
      initial={initial}
      editing={Boolean(id)}
      save={(data) => saveGrade({ id: id ?? null, data })}
    />
  );
}
