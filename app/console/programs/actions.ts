"use server";

import { revalidatePath } from "next/cache";
import { zfd } from "zod-form-data";
import { memberAction } from "@/lib/auth/action";
import { z } from "@/lib/schemas/zod";
import { cancelProgram, releaseProgram } from "@/lib/services/programs";

const id = zfd.text(z.string().max(64));

/** Release for roles allowed to; the service applies the same rules as the API (a fresh check, warnings acknowledged). */
export const releaseAction = memberAction("programs:release")
  .inputSchema(zfd.formData({ id, acknowledge: zfd.repeatable(z.array(z.string().max(64)).max(50)) }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await releaseProgram(em, member.shopId, parsedInput.id, parsedInput.acknowledge);
    revalidatePath(`/console/programs/${parsedInput.id}`);
    return { message: "Released: the gateway beside the shear can claim it now." };
  });

export const cancelAction = memberAction("programs:release")
  .inputSchema(zfd.formData({ id }))
  .action(async ({ parsedInput, ctx: { member, em } }) => {
    await cancelProgram(em, member.shopId, parsedInput.id, "cancelled in the console");
    revalidatePath(`/console/programs/${parsedInput.id}`);
    return { message: "Cancelled." };
  });
