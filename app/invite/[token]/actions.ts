"use server";

import { redirect } from "next/navigation";
import { zfd } from "zod-form-data";
import { publicAction } from "@/lib/auth/action";
import { AcceptInputSchema } from "@/lib/schemas/team";
import { acceptInvitation } from "@/lib/services/team";

const fields = AcceptInputSchema.shape;

export const acceptAction = publicAction
  .inputSchema(
    zfd.formData({ token: zfd.text(fields.token), name: zfd.text(fields.name), password: zfd.text(fields.password) }),
  )
  .action(async ({ parsedInput, ctx: { em } }) => {
    const { email } = await acceptInvitation(em, parsedInput.token, parsedInput.name, parsedInput.password);
    redirect(`/signin?joined=${encodeURIComponent(email)}`);
  });
