"use server";

import { revalidatePath } from "next/cache";
import { ApiError } from "@/lib/api/errors";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { GradeInput, GradePatch } from "@/lib/schemas/grade";
import { ShearInput, ShearPatch } from "@/lib/schemas/shear";
import * as catalog from "@/lib/services/catalog";

export type CatalogState = { ok?: string; error?: string; fieldErrors?: Record<string, string> } | null;

function fail(err: unknown): CatalogState {
  if (err instanceof ApiError) {
    const list = err.extensions.errors as { pointer: string; message: string }[] | undefined;
    return { error: err.message, fieldErrors: Object.fromEntries((list ?? []).map((e) => [e.pointer.slice(1), e.message])) };
  }
  return { error: (err as Error).message };
}

/** The same schemas as the API check what the browser sent; the form's own check is only a convenience. */
function parsed<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: { issues: { path: PropertyKey[]; message: string }[] } } }, data: unknown): T | CatalogState {
  const r = schema.safeParse(data);
  if (r.success) return r.data;
  return { error: "Some fields need attention.", fieldErrors: Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message])) };
}
const isState = (v: unknown): v is CatalogState => typeof v === "object" && v !== null && ("error" in v || "ok" in v);

export async function saveShear(id: string | null, data: unknown): Promise<CatalogState> {
  try {
    const member = await requirePermission("catalog:manage");
    const em = await requestEm();
    if (id) {
      const patch = parsed(ShearPatch, data);
      if (isState(patch)) return patch;
      await catalog.updateShear(em, member.shopId, id, patch);
    } else {
      const input = parsed(ShearInput, data);
      if (isState(input)) return input;
      await catalog.createShear(em, member.shopId, input);
    }
    revalidatePath("/console/shears");
    return { ok: "Saved." };
  } catch (err) {
    return fail(err);
  }
}

export async function saveGrade(id: string | null, data: unknown): Promise<CatalogState> {
  try {
    const member = await requirePermission("catalog:manage");
    const em = await requestEm();
    if (id) {
      const patch = parsed(GradePatch, data);
      if (isState(patch)) return patch;
      await catalog.updateGrade(em, member.shopId, id, patch);
    } else {
      const input = parsed(GradeInput, data);
      if (isState(input)) return input;
      await catalog.createGrade(em, member.shopId, input);
    }
    revalidatePath("/console/grades");
    return { ok: "Saved." };
  } catch (err) {
    return fail(err);
  }
}

export async function archiveAction(form: FormData) {
  const member = await requirePermission("catalog:manage");
  const em = await requestEm();
  const id = String(form.get("id"));
  if (id.startsWith("shr_")) await catalog.archiveShear(em, member.shopId, id);
  else await catalog.archiveGrade(em, member.shopId, id);
  revalidatePath("/console/shears");
  revalidatePath("/console/grades");
}
