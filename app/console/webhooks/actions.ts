"use server";

import { revalidatePath } from "next/cache";
import { ApiError } from "@/lib/api/errors";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { EVENT_TYPES } from "@/lib/services/event-types";
import * as webhooks from "@/lib/services/webhooks";

export type HookState = { secret?: string; ok?: string; error?: string } | null;

const message = (err: unknown) => (err instanceof ApiError ? err.message : (err as Error).message);

export async function createEndpointAction(_prev: HookState, form: FormData): Promise<HookState> {
  try {
    const member = await requirePermission("webhooks:manage");
    const types = form.getAll("eventTypes").map(String).filter((t) => (EVENT_TYPES as readonly string[]).includes(t));
    const url = String(form.get("url") ?? "");
    try {
      new URL(url);
    } catch {
      return { error: "Enter a full http:// or https:// address." };
    }
    const { secret } = await webhooks.createEndpoint(await requestEm(), member.shopId, { url, description: String(form.get("description") ?? "") || undefined, eventTypes: types });
    revalidatePath("/console/webhooks");
    return { secret, ok: "Endpoint added." };
  } catch (err) {
    return { error: message(err) };
  }
}

export async function endpointAction(_prev: HookState, form: FormData): Promise<HookState> {
  const id = String(form.get("id"));
  const action = String(form.get("action"));
  try {
    if (action === "test") {
      const member = await requirePermission("webhooks:test");
      await webhooks.sendTestEvent(await requestEm(), member.shopId, id);
      revalidatePath("/console/webhooks");
      return { ok: "Test event queued; its delivery appears below in a moment." };
    }
    const member = await requirePermission("webhooks:manage");
    const em = await requestEm();
    if (action === "rotate") {
      const { secret } = await webhooks.rotateSecret(em, member.shopId, id);
      revalidatePath("/console/webhooks");
      return { secret, ok: "New secret. For 24 hours deliveries carry signatures with both secrets." };
    }
    if (action === "enable" || action === "disable") {
      await webhooks.updateEndpoint(em, member.shopId, id, { enabled: action === "enable" });
      revalidatePath("/console/webhooks");
      return { ok: action === "enable" ? "Enabled." : "Disabled." };
    }
    if (action === "filter") {
      const types = form.getAll("eventTypes").map(String).filter((t) => (EVENT_TYPES as readonly string[]).includes(t));
      await webhooks.updateEndpoint(em, member.shopId, id, { eventTypes: types });
      revalidatePath("/console/webhooks");
      return { ok: types.length ? `Now receives ${types.length} event type${types.length === 1 ? "" : "s"}.` : "Now receives every event type." };
    }
    if (action === "resend") {
      await webhooks.resend(em, member.shopId, String(form.get("event")), id);
      revalidatePath("/console/webhooks");
      return { ok: "Resent." };
    }
    return { error: "Unknown action." };
  } catch (err) {
    return { error: message(err) };
  }
}
