import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { Shop } from "./Shop";

import { GAUGE_FAMILIES, GRADE_FAMILIES } from "../lib/schemas/enums";

export { GAUGE_FAMILIES, GRADE_FAMILIES };

const measure = () => p.float().columnType("double precision");

/** A material grade in a shop's catalog, with the strengths the shear checks use (MPa). */
export const Grade = defineEntity({
  name: "Grade",
  tableName: "grades",
  uniques: [{ properties: ["shop", "code"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("grade")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    /** the code programs refer to, e.g. "A36" */
    code: p.text(),
    name: p.text(),
    family: p.enum([...GRADE_FAMILIES]),
    /** the standard the values come from, or a note that they are typical */
    standard: p.text(),
    yieldMpa: measure().nullable(),
    tensileMinMpa: measure().nullable(),
    tensileTypicalMpa: measure().nullable(),
    tensileMaxMpa: measure().nullable(),
    /** true when the strengths are typical values rather than a standard's minimums */
    valuesAreTypical: p.boolean().default(false),
    shearTensileRatio: measure(),
    gaugeFamily: p.enum([...GAUGE_FAMILIES]).nullable(),
    hardnessHb: measure().nullable(),
    note: p.text().nullable(),
    archivedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
