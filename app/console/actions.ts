"use server";

import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { currentMember, SHOP_COOKIE } from "@/lib/auth/session";

/** Switch the shop the console works in (only to a shop the person belongs to). */
export async function switchShop(form: FormData) {
  const member = await currentMember();
  const id = String(form.get("shop") ?? "");
  if (member.shops.some((s) => s.id === id)) {
    (await cookies()).set(SHOP_COOKIE, id, { httpOnly: true, sameSite: "lax", path: "/" });
  }
  redirect("/console");
}
