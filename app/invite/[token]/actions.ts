"use server";

import { redirect } from "next/navigation";
import { ApiError } from "@/lib/api/errors";
import { requestEm } from "@/lib/db/orm";
import { acceptInvitation } from "@/lib/services/team";

export async function acceptAction(_prev: { error?: string } | null, form: FormData) {
  let email: string;
  try {
    ({ email } = await acceptInvitation(await requestEm(), String(form.get("token")), String(form.get("name") ?? ""), String(form.get("password") ?? "")));
  } catch (err) {
    return { error: err instanceof ApiError ? err.message : "Something went wrong; try the link again." };
  }
  redirect(`/signin?joined=${encodeURIComponent(email)}`);
}
