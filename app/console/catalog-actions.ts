"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { invalidRequest } from "@/lib/errors";
import { zodErrors } from "@/lib/api/route-input";
import { memberAction } from "@/lib/auth/action";
import { GradeInputSchema, GradePatchSchema } from "@/lib/schemas/grade";
import { ShearInputSchema, ShearPatchSchema } from "@/lib/schemas/shear";
import { z } from "@/lib/schemas/zod";
import * as catalog from "@/lib/services/catalog";

/** The API's own schemas check what the browser sent (the form's own check is only a convenience). */
function parsed<T>(schema: z.ZodType<T>, data: unknown): T {
  const result = schema.safeParse(data);
  if (result.success) return result.data;
  const errors = zodErrors("body", result.error);
  throw invalidRequest("Some fields need attention.", errors);
}

const save = z.object({ id: z.string().max(64).nullable(), data: z.record(z.string(), z.unknown()) });

export const saveShear = memberAction("catalog:manage")
  .inputSchema(save)
  .action(async ({ parsedInput: { id, data }, ctx: { member, em } }) => {
    if (id) await catalog.updateShear(em, member.shopId, id, parsed(ShearPatchSchema, data));
    else await catalog.createShear(em, member.shopId, parsed(ShearInputSchema, data));
    revalidatePath("/console/shears");
    return { message: "Saved." };
  });

export const saveGrade = memberAction("catalog:manage")
  .inputSchema(save)
  .action(async ({ parsedInput: { id, data }, ctx: { member, em } }) => {
    if (id) await catalog.updateGrade(em, member.shopId, id, parsed(GradePatchSchema, data));
    else await catalog.createGrade(em, member.shopId, parsed(GradeInputSchema, data));
    revalidatePath("/console/grades");
    return { message: "Saved." };
  });

export const archiveAction = memberAction("catalog:manage")
  .inputSchema(zfd.formData({ id: zfd.text(z.string().max(64)) }))
  .action(async ({ parsedInput: { id }, ctx: { member, em } }) => {
    if (id.startsWith("shr_")) await catalog.archiveShear(em, member.shopId, id);
    else await catalog.archiveGrade(em, member.shopId, id);
    revalidatePath("/console/shears");
    revalidatePath("/console/grades");
    return { message: "Archived." };
  });
