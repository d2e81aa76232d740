"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { EndpointInputSchema, EventTypeSchema } from "@/lib/schemas/webhook";
import { z } from "@/lib/schemas/zod";
import * as webhooks from "@/lib/services/webhooks";

// The API's own schema: the same address rules (http or https, length) and the same event types.
const fields = EndpointInputSchema.shape;
const id = zfd.text(z.string().max(64));
const done = <T extends object>(value: T) => {
  revalidatePath("/console/webhooks");
  return value;
};

export const createEndpointAction = memberAction("webhooks:manage")
  .inputSchema(
    zfd.formData({
      url: zfd.text(fields.url),
      description: zfd.text(fields.description),
      eventTypes: zfd.repeatable(z.array(EventTypeSchema).max(50)),
    }),
  )
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

export const resendAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id, event: zfd.text(z.string().max(64)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await webhooks.resend(em, member.shopId, parsedInput.event, parsedInput.id);
    return done({ message: "Resent." });
  });

export const updateEndpointAction = memberAction("webhooks:manage")
  .inputSchema(
    zfd.formData({
      id,
      url: zfd.text(fields.url),
      description: zfd.text(fields.description),
      eventTypes: zfd.repeatable(z.array(EventTypeSchema).max(50)),
    }),
  )
  .action(async ({ parsedInput: { id: endpointId, url, description, eventTypes }, ctx: { member, em } }) => {
    await webhooks.updateEndpoint(em, member.shopId, endpointId, { url, description: description ?? "", eventTypes });
    revalidatePath(`/console/webhooks/${endpointId}`);
    return done({ message: "Saved." });
  });

export const deleteEndpointAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await webhooks.deleteEndpoint(em, member.shopId, parsedInput.id);
    revalidatePath("/console/webhooks");
    redirect("/console/webhooks");
  });

export const resendFailedAction = memberAction("webhooks:manage")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const count = await webhooks.resendFailed(em, member.shopId, parsedInput.id);
    revalidatePath(`/console/webhooks/${parsedInput.id}`);
    return done({
      message: count
        ? `${count} failed event${count === 1 ? "" : "s"} sent again.`
        : "Nothing has failed that was not already sent again.",
    });
  });
