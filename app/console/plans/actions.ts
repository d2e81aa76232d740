"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { ApiError } from "@/lib/errors";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { PlanInputSchema } from "@/lib/schemas/plan";
import { z } from "@/lib/schemas/zod";
import { type RowError } from "@/lib/services/import";
import { parseBlanksCsv } from "@/lib/services/import-blanks";
import { cancelPlan, createPlan, writePrograms } from "@/lib/services/plans";

const MAX_BYTES = 1_048_576;
const text = (v: FormDataEntryValue | null) => (typeof v === "string" && v.trim() !== "" ? v.trim() : undefined);
const num = (v: FormDataEntryValue | null) => (text(v) === undefined ? undefined : Number(text(v)));

/** Stock lines: "length, width[, count]" one per line; an empty count is as many as needed. */
function parseStock(raw: string | undefined) {
  return (raw ?? "")
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean)
    .map((line) => {
      const [length, width, count] = line
        .split(/[,;×x\s]+/)
        .filter(Boolean)
        .map(Number);
      return count === undefined || Number.isNaN(count) ? { length, width } : { length, width, count };
    });
}

/** Why nothing was planned; `csv` is an uploaded file's rows, for the form to show in its rows box to be fixed there. */
export type PlanRefusal = {
  message?: string;
  errors?: RowError[];
  fields?: { field: string; message: string }[];
  csv?: string;
};

/** The planner form: blanks from an uploaded cut list (CSV) or pasted rows, checked with the API's schema. */
export const planAction = memberAction("programs:write")
  .inputSchema(z.instanceof(FormData))
  .action(async ({ parsedInput: form, ctx: { member, em } }): Promise<{ refused: PlanRefusal }> => {
    let fromFile: string | undefined;
    const refused = (r: PlanRefusal) => ({ refused: { ...r, csv: fromFile } });
    const file = form.get("file");
    let csv = text(form.get("blanks"));
    if (file instanceof File && file.size > 0) {
      if (file.size > MAX_BYTES) return refused({ message: "The file is larger than 1 MiB." });
      csv = fromFile = await file.text();
    }
    if (!csv) return refused({ message: "Upload a cut list (.csv) or paste its rows." });
    const parsed = parseBlanksCsv(csv);
    if (parsed.errors.length) return refused({ errors: parsed.errors });
    const thicknessKind = text(form.get("thicknessKind")) ?? "value";
    const reusableLength = num(form.get("reusableLength"));
    const reusableWidth = num(form.get("reusableWidth"));
    const input = {
      reference: text(form.get("reference")),
      title: text(form.get("title")),
      shear: text(form.get("shear")), // none: the hub checks every active shear and chooses one
      grade: text(form.get("grade")) ?? "",
      thickness:
        thicknessKind === "gauge" ? { gauge: num(form.get("thickness")) } : { value: num(form.get("thickness")) },
      units: text(form.get("units")) ?? "mm",
      stock: form.get("onHand") === "on" ? ("on_hand" as const) : parseStock(text(form.get("stock"))),
      blanks: parsed.blanks,
      options: JSON.parse(
        JSON.stringify({
          objective: text(form.get("objective")),
          trim: num(form.get("trim")),
          overProductionPct: num(form.get("overProductionPct")),
          reusableOffcut:
            reusableLength && reusableWidth ? { length: reusableLength, width: reusableWidth } : undefined,
          offcutsAsStock: form.get("offcutsAsStock") === "on" ? true : undefined,
        }),
      ),
    };
    const result = PlanInputSchema.safeParse(input);
    if (!result.success) {
      return refused({
        fields: result.error.issues.map((issue) => {
          const [head, row, ...rest] = issue.path;
          const field =
            head === "blanks" && typeof row === "number"
              ? `row ${row + 2}${rest.length ? ` · ${rest.join(".")}` : ""}`
              : issue.path.join(".") || "form";
          return { field, message: issue.message };
        }),
      });
    }
    let id: string;
    try {
      id = (await createPlan(em, member.shopId, result.data)).id;
    } catch (err) {
      if (!(err instanceof ApiError) || err.status >= 500) throw err;
      const errs = (err.extensions.errors as { pointer: string; message: string }[] | undefined) ?? [];
      return refused({
        message: err.message,
        fields: errs.map((e) => ({ field: e.pointer.slice(1).replace(/\//g, "."), message: e.message })),
      });
    }
    revalidatePath("/console/plans");
    redirect(`/console/plans/${id}`);
  });

export const writeProgramsAction = memberAction("programs:write")
  .inputSchema(
    zfd.formData({ plan: zfd.text(z.string().max(64)), prefix: zfd.text(z.string().trim().max(90).optional()) }),
  )
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const written = await writePrograms(em, member.shopId, parsedInput.plan, { referencePrefix: parsedInput.prefix });
    revalidatePath(`/console/plans/${parsedInput.plan}`);
    revalidatePath("/console/programs");
    return { message: `${written.data.length} draft program${written.data.length === 1 ? "" : "s"} written.` };
  });

export const cancelPlanAction = memberAction("programs:write")
  .inputSchema(zfd.formData({ plan: zfd.text(z.string().max(64)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await cancelPlan(em, member.shopId, parsedInput.plan);
    revalidatePath(`/console/plans/${parsedInput.plan}`);
    return { message: "Cancelled." };
  });
