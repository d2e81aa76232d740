"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { EndpointInput, EventType } from "@/lib/schemas/webhook";
import { z } from "@/lib/schemas/zod";
import * as webhooks from "@/lib/services/webhooks";

// The API's own schema: the same address rules (http or https, length) and the same event types.
const fields = EndpointInput.shape;
const id = zfd.text(z.string().max(64));
const done = <T extends object>(value: T) => {
  revalidatePath("/console/webhooks");
  return value;
};

export const createEndpointAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ url: zfd.text(fields.url), description: zfd.text(fields.description), eventTypes: zfd.repeatable(z.array(EventType).max(50)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const { secret } = await webhooks.createEndpoint(em, member.shopId, parsedInput);
    return done({ secret, message: "Endpoint added." });
  });

export const testEndpointAction = memberAction("webhooks:test")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await webhooks.sendTestEvent(em, member.shopId, parsedInput.id);
    return done({ message: "Test event queued; its delivery appears below in a moment." });
  });

export const rotateSecretAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const { secret } = await webhooks.rotateSecret(em, member.shopId, parsedInput.id);
    return done({ secret, message: "New secret. For 24 hours deliveries carry signatures with both secrets." });
  });

export const setEnabledAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id, enabled: zfd.text(z.enum(["true", "false"])) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const enabled = parsedInput.enabled === "true";
    await webhooks.updateEndpoint(em, member.shopId, parsedInput.id, { enabled });
    return done({ message: enabled ? "Enabled." : "Disabled." });
  });

export const eventTypesAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id, eventTypes: zfd.repeatable(z.array(EventType).max(50)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const types = parsedInput.eventTypes;
    await webhooks.updateEndpoint(em, member.shopId, parsedInput.id, { eventTypes: types });
    return done({ message: types.length ? `Now receives ${types.length} event type${types.length === 1 ? "" : "s"}.` : "Now receives every event type." });
  });

export const resendAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id, event: zfd.text(z.string().max(64)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await webhooks.resend(em, member.shopId, parsedInput.event, parsedInput.id);
    return done({ message: "Resent." });
  });
