/**
 * The team of a shop: members and their roles, invitations by e-mail (the link sets the
 * password), removal. A shop always keeps at least one owner.
 */
import { createHash, randomBytes } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import bcrypt from "bcryptjs";
import { Invitation, Membership, Shop, User } from "../../entities";
import type { Role } from "../../lib/schemas/enums";
import { conflict, invalidRequest, notFound } from "../errors";
import { MIN_PASSWORD } from "../schemas/team";
import { sendMail } from "./mail";
import { endUserSessions } from "./sessions";

const INVITE_DAYS = 7;
const digest = (token: string) => createHash("sha256").update(token).digest("hex");

export async function listTeam(em: EntityManager, shopId: string) {
  const members = await em.find(Membership, { shop: shopId }, { populate: ["user"], orderBy: { createdAt: "asc" } });
  const invitations = await em.find(
    Invitation,
    { shop: shopId, acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
    { orderBy: { createdAt: "desc" } },
  );
  return {
    members: members.map((member) => ({
      id: member.id,
      userId: member.user.id,
      name: member.user.name,
      email: member.user.email,
      role: member.role,
    })),
    invitations: invitations.map((invitation) => ({
      id: invitation.id,
      email: invitation.email,
      role: invitation.role,
      expiresAt: invitation.expiresAt.toISOString(),
    })),
  };
}

export async function invite(
  em: EntityManager,
  shopId: string,
  by: { userId: string; name: string },
  email: string,
  role: Role,
) {
  const address = email.trim().toLowerCase();
  if (!/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(address))
    throw invalidRequest("That is not an e-mail address.", [
      { location: "body", pointer: "/email", message: "not an e-mail address" },
    ]);
  const existing = await em.findOne(Membership, { shop: shopId, user: { email: address } });
  if (existing) throw conflict(`${address} is already in this shop.`);
  const shop = await em.findOneOrFail(Shop, { id: shopId });
  const token = randomBytes(24).toString("base64url");
  em.create(Invitation, {
    shop,
    email: address,
    role,
    tokenHash: digest(token),
    invitedBy: by.userId,
    expiresAt: new Date(Date.now() + INVITE_DAYS * 86_400_000),
  });
  await em.flush();
  const link = `${process.env.SHEARWIRE_BASE_URL ?? "http://127.0.0.1:3000"}/invite/${token}`;
  await sendMail(
    [address],
    `${by.name} invited you to ${shop.name} on Shearwire`,
    [
      `${by.name} invited you to join ${shop.name} on Shearwire as ${role}.`,
      "",
      `Set your password and sign in here (the link works for ${INVITE_DAYS} days, once):`,
      link,
    ].join("\n"),
  );
  return { link };
}

export async function findInvitation(em: EntityManager, token: string) {
  const inv = await em.findOne(Invitation, { tokenHash: digest(token) }, { populate: ["shop"] });
  if (!inv || inv.acceptedAt || inv.revokedAt || inv.expiresAt <= new Date()) return null;
  return inv;
}

/** Accept an invitation: set the password (or keep an existing account's) and join the shop. */
export async function acceptInvitation(em: EntityManager, token: string, name: string, password: string) {
  if (password.length < MIN_PASSWORD)
    throw invalidRequest(`Choose a password of at least ${MIN_PASSWORD} characters.`, [
      { location: "body", pointer: "/password", message: "too short" },
    ]);
  return em.transactional(async (tx) => {
    const inv = await findInvitation(tx, token);
    if (!inv) throw notFound("invitation (it may have expired or been used)");
    let user = await tx.findOne(User, { email: inv.email });
    const hash = await bcrypt.hash(password, 10);
    if (!user) user = tx.create(User, { email: inv.email, name: name.trim() || inv.email, passwordHash: hash });
    else if (!user.passwordHash) {
      user.passwordHash = hash;
      await endUserSessions(tx, user.id, "password-changed");
    }
    tx.create(Membership, { user, shop: inv.shop, role: inv.role });
    inv.acceptedAt = new Date();
    return { email: inv.email };
  });
}

async function owners(em: EntityManager, shopId: string) {
  return em.count(Membership, { shop: shopId, role: "owner" });
}

export async function changeRole(em: EntityManager, shopId: string, membershipId: string, role: Role) {
  const membership = await em.findOne(Membership, { id: membershipId, shop: shopId });
  if (!membership) throw notFound("member");
  if (membership.role === "owner" && role !== "owner" && (await owners(em, shopId)) <= 1)
    throw conflict("A shop keeps at least one owner: make someone else owner first.");
  const changed = membership.role !== role;
  membership.role = role;
  await em.flush();
  // The person's sessions carried the old role: end them, so the new one applies from their next sign-in.
  if (changed) await endUserSessions(em, membership.user.id, "role-changed");
}

export async function removeMember(em: EntityManager, shopId: string, membershipId: string) {
  const membership = await em.findOne(Membership, { id: membershipId, shop: shopId });
  if (!membership) throw notFound("member");
  if (membership.role === "owner" && (await owners(em, shopId)) <= 1)
    throw conflict("The last owner cannot be removed.");
  const userId = membership.user.id;
  await em.remove(membership).flush();
  await endUserSessions(em, userId, "removed");
}

export async function revokeInvitation(em: EntityManager, shopId: string, id: string) {
  const inv = await em.findOne(Invitation, { id, shop: shopId });
  if (!inv) throw notFound("invitation");
  inv.revokedAt ??= new Date();
  await em.flush();
}
