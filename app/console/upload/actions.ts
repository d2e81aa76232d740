"use server";

import { revalidatePath } from "next/cache";
import { memberAction } from "@/lib/auth/action";
import { z } from "@/lib/schemas/zod";
import { importPrograms, parseCsv, parseJson, resolveShearNames, validate, type RowError } from "@/lib/services/import";

const MAX_BYTES = 1_048_576;

type Outcome = {
  created?: { id: string; reference: string; validation: string }[];
  errors?: RowError[];
  message?: string;
};

export const uploadAction = memberAction("programs:write")
  .inputSchema(z.instanceof(FormData))
  .action(async ({ parsedInput: form, ctx: { member, em } }): Promise<Outcome> => {
    const file = form.get("file");
    if (!(file instanceof File) || file.size === 0) return { message: "Choose a .csv or .json file." };
    if (file.size > MAX_BYTES) return { message: "The file is larger than 1 MiB." };
    const content = await file.text();
    const parsed = await resolveShearNames(
      em,
      member.shopId,
      /\.json$/i.test(file.name) || content.trimStart().startsWith("{") || content.trimStart().startsWith("[")
        ? parseJson(content)
        : parseCsv(content),
    );
    const rowsOf = (i: number) => parsed.programs[i]?.rows[0] ?? 0; // all parsed programs are valid by the time this is used
    const { inputs, errors } = validate(parsed);
    if (errors.length) return { errors };
    const result = await importPrograms(em, member.shopId, inputs, rowsOf);
    if (result.errors.length) return { errors: result.errors };
    revalidatePath("/console/programs");
    return { created: result.created };
  });
