import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";

/** A person who signs in to the console. Belongs to shops through memberships. */
export const User = defineEntity({
  name: "User",
  tableName: "users",
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("user")),
    email: p.text().unique(),
    name: p.text(),
    passwordHash: p.string().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
