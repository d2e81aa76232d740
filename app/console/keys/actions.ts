"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { can } from "@/lib/auth/roles";
import { NotAllowedError } from "@/lib/auth/session";
import { KeyInputSchema, READ_ONLY_SCOPES } from "@/lib/schemas/key";
import { z } from "@/lib/schemas/zod";
import { createKey, revokeKey } from "@/lib/services/keys";

const fields = KeyInputSchema.shape;

/**
 * Create a key; its secret goes back to this one response and is never stored. Admins and
 * owners give any scopes; a developer may create read-only keys for their own work.
 */
export const createKeyAction = memberAction("keys:create-read-only")
  .inputSchema(
    zfd.formData({
      name: zfd.text(fields.name),
      scopes: zfd.repeatable(fields.scopes),
      shears: zfd.repeatable(fields.shears),
      expires: zfd.text(fields.expires),
    }),
  )
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const beyond = parsedInput.scopes.filter((scope) => !READ_ONLY_SCOPES.includes(scope));
    if (!can(member.role, "keys:manage") && beyond.length) {
      throw new NotAllowedError(
        `Your role (${member.role}) may create read-only keys (${READ_ONLY_SCOPES.join(", ")}); ${beyond.join(", ")} need an admin or owner.`,
      );
    }
    const expiresAt = parsedInput.expires ? new Date(`${parsedInput.expires}T23:59:59Z`) : null;
    const { key, secret } = await createKey(em, member.shopId, {
      name: parsedInput.name,
      scopes: parsedInput.scopes,
      shearIds: parsedInput.shears,
      expiresAt,
      createdBy: member.userId,
    });
    revalidatePath("/console/keys");
    return { secret, prefix: key.prefix, message: `Key ${key.name} created.` };
  });

export const revokeKeyAction = memberAction("keys:manage")
  .inputSchema(zfd.formData({ id: zfd.text(z.string().max(64)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    const key = await revokeKey(em, member.shopId, parsedInput.id);
    revalidatePath("/console/keys");
    return { message: `${key.name} is revoked: requests with it fail from the next one on.` };
  });
