import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { User } from "./User";

/**
 * A console sign-in. The session cookie (a signed JWT) names this row, and every console
 * page, action and feed checks it: signing out, a role change, removal from a shop or a new
 * password revokes the row, and the cookie stops working on the next request.
 */
export const ConsoleSession = defineEntity({
  name: "ConsoleSession",
  tableName: "console_sessions",
  indexes: [{ properties: ["user", "revokedAt"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("session")),
    user: () => p.manyToOne(User).deleteRule("cascade"),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
    revokedAt: p.datetime().nullable(),
    /** signed-out | role-changed | removed | password-changed */
    revokedReason: p.text().nullable(),
  },
});
