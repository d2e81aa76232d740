"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { ROLES } from "@/lib/schemas/enums";
import { InviteInputSchema } from "@/lib/schemas/team";
import { z } from "@/lib/schemas/zod";
import * as team from "@/lib/services/team";

const id = zfd.text(z.string().max(64));
const done = <T extends object>(value: T) => {
  revalidatePath("/console/team");
  return value;
};

export const inviteAction = memberAction("team:manage")
  .inputSchema(
    zfd.formData({ email: zfd.text(InviteInputSchema.shape.email), role: zfd.text(InviteInputSchema.shape.role) }),
  )
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await team.invite(em, member.shopId, member, parsedInput.email, parsedInput.role);
    return done({ message: `Invitation sent to ${parsedInput.email}.` });
  });

export const changeRoleAction = memberAction("team:manage")
  .inputSchema(zfd.formData({ id, role: zfd.text(z.enum(ROLES)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await team.changeRole(em, member.shopId, parsedInput.id, parsedInput.role);
    return done({ message: `Now ${parsedInput.role}.` });
  });

export const removeMemberAction = memberAction("team:manage")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await team.removeMember(em, member.shopId, parsedInput.id);
    return done({ message: "Removed." });
  });

export const withdrawInviteAction = memberAction("team:manage")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await team.revokeInvitation(em, member.shopId, parsedInput.id);
    return done({ message: "Withdrawn." });
  });
