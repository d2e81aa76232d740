/**
 * The signed-in person and their role in the shop they are working in, for server
 * components, server actions and console route handlers. The active shop is a cookie the
 * person chooses, always checked against their memberships.
 */
import { getServerSession } from "next-auth";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { Membership } from "../../entities";
import type { Role } from "../../lib/schemas/enums";
import { requestEm } from "../db/orm";
import { sessionActive } from "../services/sessions";
import { authOptions } from "./options";

export const SHOP_COOKIE = "sw_shop";

export interface Member {
  userId: string;
  name: string;
  email: string;
  shopId: string;
  shopName: string;
  role: Role;
  shops: { id: string; name: string; role: Role }[];
}

export class NotAllowedError extends Error {}

/** The current member, or a redirect to sign-in (no session, or one that was ended on the server). */
export async function currentMember(): Promise<Member> {
  const session = await getServerSession(authOptions);
  const { id: userId, sid } = (session?.user as { id?: string; sid?: string } | undefined) ?? {};
  if (!userId || !sid) redirect("/signin");
  const em = await requestEm();
  if (!(await sessionActive(em, sid, userId))) redirect("/signin?error=session-ended");
  const memberships = await em.find(
    Membership,
    { user: userId },
    { populate: ["shop", "user"], orderBy: { createdAt: "asc" } },
  );
  if (!memberships.length) redirect("/signin?error=no-shop");
  const wanted = (await cookies()).get(SHOP_COOKIE)?.value;
  const active = memberships.find((m) => m.shop.id === wanted) ?? memberships[0];
  return {
    userId,
    name: active.user.name,
    email: active.user.email,
    shopId: active.shop.id,
    shopName: active.shop.name,
    role: active.role,
    shops: memberships.map((m) => ({ id: m.shop.id, name: m.shop.name, role: m.role })),
  };
}
