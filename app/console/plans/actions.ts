"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { ApiError } from "@/lib/api/errors";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { PlanInput } from "@/lib/schemas/plan";
import { parseBlanksCsv, type RowError } from "@/lib/services/import";
import { createPlan, writePrograms } from "@/lib/services/plans";

/** What went wrong, and what was sent (the form shows it again: a form action resets the form). */
export type PlanFormState = { error?: string; errors?: RowError[]; fields?: { field: string; message: string }[]; values?: Record<string, string> } | null;

const MAX_BYTES = 1_048_576;
const text = (v: FormDataEntryValue | null) => (typeof v === "string" && v.trim() !== "" ? v.trim() : undefined);
const num = (v: FormDataEntryValue | null) => (text(v) === undefined ? undefined : Number(text(v)));

/** Stock lines: "length, width[, count]" one per line; an empty count is as many as needed. */
function parseStock(v: string | undefined) {
  return (v ?? "").split(/\r?\n/).map((l) => l.trim()).filter(Boolean).map((line) => {
    const [length, width, count] = line.split(/[,;×x\s]+/).filter(Boolean).map(Number);
    return count === undefined || Number.isNaN(count) ? { length, width } : { length, width, count };
  });
}

/** The planner form: blanks from an uploaded cut list (CSV) or pasted rows, checked with the API's schema. */
export async function planAction(_prev: PlanFormState, form: FormData): Promise<PlanFormState> {
  const state = await planOrRefuse(form);
  if (typeof state === "string") {
    revalidatePath("/console/plans");
    redirect(`/console/plans/${state}`);
  }
  return state;
}

async function planOrRefuse(form: FormData): Promise<string | NonNullable<PlanFormState>> {
  const values: Record<string, string> = {};
  for (const [k, v] of form.entries()) if (typeof v === "string") values[k] = v;
  const refuse = (s: Omit<NonNullable<PlanFormState>, "values">) => ({ ...s, values });
  let id: string;
  try {
    const member = await requirePermission("programs:write");
    const file = form.get("file");
    let csv = text(form.get("blanks"));
    if (file instanceof File && file.size > 0) {
      if (file.size > MAX_BYTES) return refuse({ error: "The file is larger than 1 MiB." });
      csv = await file.text();
      values.blanks = csv; // shown in the rows box, to be fixed there
    }
    if (!csv) return refuse({ error: "Upload a cut list (.csv) or paste its rows." });
    const parsed = parseBlanksCsv(csv);
    if (parsed.errors.length) return refuse({ errors: parsed.errors });
    const thicknessKind = text(form.get("thicknessKind")) ?? "value";
    const objective = text(form.get("objective"));
    const reusableLength = num(form.get("reusableLength"));
    const reusableWidth = num(form.get("reusableWidth"));
    const input = {
      reference: text(form.get("reference")),
      title: text(form.get("title")),
      shear: text(form.get("shear")) ?? "",
      grade: text(form.get("grade")) ?? "",
      thickness: thicknessKind === "gauge" ? { gauge: num(form.get("thickness")) } : { value: num(form.get("thickness")) },
      units: text(form.get("units")) ?? "mm",
      stock: parseStock(text(form.get("stock"))),
      blanks: parsed.blanks,
      options: JSON.parse(JSON.stringify({
        objective,
        trim: num(form.get("trim")),
        overProductionPct: num(form.get("overProductionPct")),
        reusableOffcut: reusableLength && reusableWidth ? { length: reusableLength, width: reusableWidth } : undefined,
        offcutsAsStock: form.get("offcutsAsStock") === "on" ? true : undefined,
      })),
    };
    const result = PlanInput.safeParse(input);
    if (!result.success) {
      return refuse({
        fields: result.error.issues.map((i) => {
          const [head, row, ...rest] = i.path;
          const field = head === "blanks" && typeof row === "number" ? `row ${row + 2}${rest.length ? ` · ${rest.join(".")}` : ""}` : i.path.join(".") || "form";
          return { field, message: i.message };
        }),
      });
    }
    const plan = await createPlan(await requestEm(), member.shopId, result.data);
    id = plan.id;
  } catch (err) {
    if (err instanceof ApiError) {
      const errs = (err.extensions.errors as { pointer: string; message: string }[] | undefined) ?? [];
      return refuse({ error: err.message, fields: errs.map((e) => ({ field: e.pointer.slice(1).replace(/\//g, "."), message: e.message })) });
    }
    return refuse({ error: (err as Error).message });
  }
  return id;
}

export type WriteState = { error?: string } | null;

export async function writeProgramsAction(_prev: WriteState, form: FormData): Promise<WriteState> {
  const id = String(form.get("plan") ?? "");
  try {
    const member = await requirePermission("programs:write");
    await writePrograms(await requestEm(), member.shopId, id, { referencePrefix: text(form.get("prefix")) });
  } catch (err) {
    return { error: (err as Error).message };
  }
  revalidatePath(`/console/plans/${id}`);
  revalidatePath("/console/programs");
  return null;
}
