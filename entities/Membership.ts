import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { Shop } from "./Shop";
import { User } from "./User";

import { ROLES } from "../lib/schemas/enums";

/** A user's role in one shop. A user may belong to several shops. */
export const Membership = defineEntity({
  name: "Membership",
  tableName: "memberships",
  uniques: [{ properties: ["user", "shop"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("membership")),
    user: () => p.manyToOne(User).deleteRule("cascade"),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    role: p.enum([...ROLES]),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
