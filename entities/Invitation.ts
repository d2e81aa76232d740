import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { ROLES } from "../lib/schemas/enums";
import { Shop } from "./Shop";

/** An invitation to join a shop with a role; the e-mailed link (a one-time token) sets the password. */
export const Invitation = defineEntity({
  name: "Invitation",
  tableName: "invitations",
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("invitation")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    email: p.text(),
    role: p.enum([...ROLES]),
    /** SHA-256 of the token in the link */
    tokenHash: p.string().unique(),
    invitedBy: p.string(),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
