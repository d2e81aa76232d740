"use server";

import { revalidatePath } from "next/cache";
import { ApiError } from "@/lib/api/errors";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { cancelProgram, releaseProgram } from "@/lib/services/programs";

export type ActionState = { ok?: string; error?: string } | null;

/** Release or cancel, for roles allowed to; the services apply the same rules as the API. */
export async function programAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  try {
    const member = await requirePermission("programs:release");
    const id = String(form.get("id"));
    const em = await requestEm();
    if (form.get("action") === "release") {
      const ack = form.getAll("acknowledge").map(String);
      await releaseProgram(em, member.shopId, id, ack);
      revalidatePath(`/console/programs/${id}`);
      return { ok: "Released: the gateway beside the shear can claim it now." };
    }
    await cancelProgram(em, member.shopId, id, "cancelled in the console");
    revalidatePath(`/console/programs/${id}`);
    return { ok: "Cancelled." };
  } catch (err) {
    return { error: err instanceof ApiError ? err.message : (err as Error).message };
  }
}
