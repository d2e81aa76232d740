import { defineEntity, p } from "@mikro-orm/core";
import type { PlanOrderT } from "../lib/schemas/plan";
import type { PLAN_FAILURES, PlanResultT } from "../lib/schemas/plan-result";
import { newId } from "../lib/ids";
import { PLAN_STATUSES } from "../lib/schemas/enums";
import type { RoutingT } from "../lib/schemas/settings";
import { Shear } from "./Shear";
import { Shop } from "./Shop";

/**
 * A plan: the order it was asked for (as sent, in the caller's units) and, once a worker has
 * computed it, what the planner made of it (sheet patterns, demand met, findings), kept as
 * computed so a plan reads the same later even when the catalog changes. It is a job:
 * `queued` → `running` → `complete` | `failed` | `cancelled`, with its progress while it runs.
 * `programs` lists the cut programs written from it, once.
 */
export const Plan = defineEntity({
  name: "Plan",
  tableName: "plans",
  indexes: [{ properties: ["shop", "id"] }, { properties: ["status", "updatedAt"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("plan")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    shear: () => p.manyToOne(Shear).deleteRule("restrict"),
    reference: p.text().nullable(),
    title: p.text().nullable(),
    status: p.enum([...PLAN_STATUSES]),
    input: p.json<PlanOrderT>(),
    /** the planner's answer, once complete */
    // Plans stored before the planner stated bounds lack them: read through viewPlan (plan-views.ts).
    result: p.json<PlanResultT>().nullable(),
    progress: p.json<{ patterns: number; piecesPlaced: number; piecesWanted: number }>().nullable(),
    failure: p.json<{ reason: (typeof PLAN_FAILURES)[number]; message: string }>().nullable(),
    attempts: p.integer().default(0),
    programs: p.json<{ pattern: string; id: string }[]>().default("[]"),
    /** how the shear was chosen when the request named none; null when it named one */
    routing: p.json<RoutingT>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    startedAt: p.datetime().nullable(),
    finishedAt: p.datetime().nullable(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
