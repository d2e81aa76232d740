"use server";

import { revalidatePath } from "next/cache";
import { requirePermission } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { importPrograms, parseCsv, parseJson, validate, type RowError } from "@/lib/services/import";

export type UploadState = { created?: { id: string; reference: string; validation: string }[]; errors?: RowError[]; error?: string } | null;

const MAX_BYTES = 1_048_576;

export async function uploadAction(_prev: UploadState, form: FormData): Promise<UploadState> {
  try {
    const member = await requirePermission("programs:write");
    const file = form.get("file");
    if (!(file instanceof File) || file.size === 0) return { error: "Choose a .csv or .json file." };
    if (file.size > MAX_BYTES) return { error: "The file is larger than 1 MiB." };
    const content = await file.text();
    const parsed = /\.json$/i.test(file.name) || content.trimStart().startsWith("{") || content.trimStart().startsWith("[") ? parseJson(content) : parseCsv(content);
    const rowsOf = (i: number) => parsed.programs[i]?.rows[0] ?? 0; // all parsed programs are valid by the time this is used
    const { inputs, errors } = validate(parsed);
    if (errors.length) return { errors };
    const result = await importPrograms(await requestEm(), member.shopId, inputs, rowsOf);
    if (result.errors.length) return { errors: result.errors };
    revalidatePath("/console/programs");
    return { created: result.created };
  } catch (err) {
    return { error: (err as Error).message };
  }
}
