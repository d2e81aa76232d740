"use server";

import { revalidatePath } from "next/cache";
import { ROLES, type Role } from "@/entities/Membership";
import { ApiError } from "@/lib/api/errors";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import * as team from "@/lib/services/team";

export type TeamState = { ok?: string; error?: string } | null;
const role = (v: FormDataEntryValue | null): Role => (ROLES.includes(String(v) as Role) ? (String(v) as Role) : "viewer");
const fail = (err: unknown): TeamState => ({ error: err instanceof ApiError ? err.message : (err as Error).message });

export async function inviteAction(_prev: TeamState, form: FormData): Promise<TeamState> {
  try {
    const member = await requirePermission("team:manage");
    const email = String(form.get("email") ?? "");
    await team.invite(await requestEm(), member.shopId, member, email, role(form.get("role")));
    revalidatePath("/console/team");
    return { ok: `Invitation sent to ${email}.` };
  } catch (err) {
    return fail(err);
  }
}

export async function memberAction(_prev: TeamState, form: FormData): Promise<TeamState> {
  try {
    const member = await requirePermission("team:manage");
    const em = await requestEm();
    const id = String(form.get("id"));
    const action = String(form.get("action"));
    if (action === "role") await team.changeRole(em, member.shopId, id, role(form.get("role")));
    else if (action === "remove") await team.removeMember(em, member.shopId, id);
    else if (action === "revoke-invite") await team.revokeInvitation(em, member.shopId, id);
    revalidatePath("/console/team");
    return { ok: "Saved." };
  } catch (err) {
    return fail(err);
  }
}
