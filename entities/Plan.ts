import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { Shear } from "./Shear";
import { Shop } from "./Shop";

/**
 * A plan: the blanks and stock it was asked for (as sent, in the caller's units) and what the
 * planner made of them (sheet patterns, demand met, findings), kept as computed so a plan
 * reads the same later even when the catalog changes. `programs` lists the cut programs
 * written from it, once.
 */
export const Plan = defineEntity({
  name: "Plan",
  tableName: "plans",
  indexes: [{ properties: ["shop", "id"] }],
  properties: {
    id: p.string().primary().onCreate(() => newId("plan")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    shear: () => p.manyToOne(Shear).deleteRule("restrict"),
    reference: p.text().nullable(),
    title: p.text().nullable(),
    /** complete | partial */
    status: p.string(),
    input: p.json<Record<string, unknown>>(),
    result: p.json<Record<string, unknown>>(),
    programs: p.json<{ pattern: string; id: string }[]>().default("[]"),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
