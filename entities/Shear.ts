import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { Shop } from "./Shop";

/** Real (double precision) column holding a measured quantity; the unit is in the property name. */
const measure = () => p.float().columnType("double precision");

/**
 * A shear's capacity profile. Every length is in millimetres, strengths in MPa, angles in
 * degrees and times in seconds; the API converts to and from the caller's units.
 */
export const Shear = defineEntity({
  name: "Shear",
  tableName: "shears",
  uniques: [{ properties: ["shop", "name"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("shear")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    name: p.text(),
    description: p.text().nullable(),
    /** the rating: the thickness of the rating material the shear cuts at the rated rake */
    ratedThicknessMm: measure(),
    ratedTensileMpa: measure(),
    ratedRakeDeg: measure(),
    bladeLengthMm: measure(),
    backgaugeMinMm: measure(),
    backgaugeMaxMm: measure(),
    rakeMinDeg: measure(),
    rakeMaxDeg: measure(),
    gapMinMm: measure(),
    gapMaxMm: measure(),
    strokesPerMin: measure(),
    backgaugeSpeedMmPerS: measure(),
    /** the backgauge's stated repeatability (±), mm; null = not stated (the core's default remnant tolerance) */
    backgaugeRepeatabilityMm: measure().nullable(),
    handlingSecondsPerTurn: measure(),
    handlingSecondsPerSheet: measure(),
    /** hardest material (Brinell) the fitted blades are meant for; null = not stated */
    maxBladeHardnessHb: measure().nullable(),
    /** explicit maximum thickness per grade code, in mm; wins over the derived value */
    gradeThicknessLimitsMm: p.json<Record<string, number>>().default("{}"),
    /** force-proportional crown correction at full rated force, mm; null = the core's default */
    crownAtRatedMm: measure().nullable(),
    /** ends-minus-centre blade gap with no load (blade straightness, the beam's geometry), mm; null = the core's default */
    crownBaselineMm: measure().nullable(),
    archivedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
