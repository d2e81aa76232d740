import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";

/** A console sign-in attempt that failed (wrong password, unknown account, or throttled): who tried, from where, when. */
export const SignInAttempt = defineEntity({
  name: "SignInAttempt",
  tableName: "sign_in_attempts",
  indexes: [{ properties: ["email", "createdAt"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("signInAttempt")),
    email: p.text(),
    /** the client address as the server saw it (the first X-Forwarded-For entry behind a proxy) */
    address: p.text(),
    /** wrong-password | throttled */
    outcome: p.text(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
