import { defineEntity, p } from "@mikro-orm/core";
import type { CheckT } from "../lib/schemas/check";
import type { ProgramInputT } from "../lib/schemas/program";
import { newId } from "../lib/ids";
import type { RoutingT } from "../lib/schemas/settings";
import { Shear } from "./Shear";
import { Shop } from "./Shop";

import { PROGRAM_STATUSES, VALIDATIONS, type ProgramStatus } from "../lib/schemas/enums";

export { PROGRAM_STATUSES, type ProgramStatus };

/**
 * A cut program: the request as the caller sent it (in the caller's units), and what the
 * shear core made of it when it was last checked. Only drafts change; each change bumps
 * the revision, which is the ETag.
 */
export const Program = defineEntity({
  name: "Program",
  tableName: "programs",
  uniques: [{ properties: ["shop", "reference"] }],
  indexes: [
    { properties: ["shop", "status", "id"] },
    { properties: ["shear", "status", "priority", "dueAt"] },
    { properties: ["status", "leaseExpiresAt"] },
    { properties: ["shop", "updatedAt", "id"] },
  ],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("program")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    shear: () => p.manyToOne(Shear).deleteRule("restrict"),
    reference: p.text(),
    title: p.text().nullable(),
    status: p.enum([...PROGRAM_STATUSES]).default("draft"),
    revision: p.integer().version(),
    /** the program as submitted (units, sheet, cuts, setup overrides …) */
    input: p.json<ProgramInputT>(),
    gradeCode: p.text(),
    units: p.string(),
    priority: p.integer().default(0),
    dueAt: p.datetime().nullable(),
    /** pass | warn | fail, and the full check: findings, setup, force, yield, estimate */
    validation: p.enum([...VALIDATIONS]),
    /**
     * JSON kept as `text`: written once (by `JSON.stringify`), read whole, never queried inside. `jsonb` parses
     * kilobytes of numbers slowly, and `json` only checks the text again on every insert (migration 20261204070000).
     */
    check: p.json<CheckT>().columnType("text"),
    /** warning codes the caller acknowledged when releasing */
    acknowledged: p.json<string[]>().default("[]"),
    metadata: p.json<Record<string, string>>().default("{}"),
    /** how the shear was chosen when the request named none; null when it named one */
    routing: p.json<RoutingT>().nullable(),
    releasedAt: p.datetime().nullable(),
    cancelledAt: p.datetime().nullable(),
    // The gateway's lease while the program is claimed or running.
    /** the API key (a gateway's) that holds the lease */
    claimedBy: p.string().nullable(),
    leaseExpiresAt: p.datetime().nullable(),
    /** how many times a lease on this program expired (a gateway went quiet) */
    leaseExpiries: p.integer().default(0),
    claimedAt: p.datetime().nullable(),
    startedAt: p.datetime().nullable(),
    finishedAt: p.datetime().nullable(),
    /** the last progress report: groups and strokes done */
    progress: p.json<{ groupsDone: number; strokesDone: number; piecesDone?: number } | null>().nullable(),
    /** the completion or failure report */
    outcome: p.json<Record<string, unknown> | null>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
