"use server";

import { revalidatePath } from "next/cache";
import { SCOPES, type Scope } from "@/entities/ApiKey";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { createKey, revokeKey } from "@/lib/services/keys";

export type KeyState = { secret?: string; prefix?: string; error?: string } | null;

/** Create a key; its secret goes back to this one response and is never stored. */
export async function createKeyAction(_prev: KeyState, form: FormData): Promise<KeyState> {
  try {
    const member = await requirePermission("keys:manage");
    const name = String(form.get("name") ?? "").trim();
    const scopes = form.getAll("scopes").map(String).filter((s): s is Scope => (SCOPES as readonly string[]).includes(s));
    if (!name) return { error: "Give the key a name, e.g. the system that will use it." };
    if (!scopes.length) return { error: "Choose at least one scope." };
    const expires = String(form.get("expires") ?? "");
    const expiresAt = expires ? new Date(`${expires}T23:59:59Z`) : null;
    if (expiresAt && (Number.isNaN(expiresAt.getTime()) || expiresAt <= new Date())) return { error: "The expiry date must be in the future." };
    const shearIds = form.getAll("shears").map(String).filter(Boolean);
    const { key, secret } = await createKey(await requestEm(), member.shopId, { name, scopes, shearIds, expiresAt, createdBy: member.userId });
    revalidatePath("/console/keys");
    return { secret, prefix: key.prefix };
  } catch (err) {
    return { error: (err as Error).message };
  }
}

export async function revokeKeyAction(form: FormData) {
  const member = await requirePermission("keys:manage");
  await revokeKey(await requestEm(), member.shopId, String(form.get("id")));
  revalidatePath("/console/keys");
}
