/** Stand-alone setup recommendations and gauge tables, from the shear core. */
import type { EntityManager } from "@mikro-orm/postgresql";
import { invalidRequest } from "../errors";
import {
  GAUGE_FAMILY_NAMES,
  checkProgram,
  gaugeTable,
  gaugeThicknessMm,
  lengthToMm,
  recommendSetup,
  roundTo,
  type GaugeFamily,
  type LengthUnit,
} from "../shear";
import type { z } from "zod";
import type { SetupRequestSchema } from "../schemas/catalog";
import { gradeByCode, gradeProfile, shearProfile } from "./catalog";
import { Shear } from "../../entities";

const DEFINITIONS: Record<GaugeFamily, string> = {
  msg: "Weight of 41.82 lb per square foot per inch of thickness, at the weight the gauge number names.",
  galvanized: "Manufacturers' Standard Gauge weight plus 2.5 oz per square foot of zinc coating.",
  ussg: "US Standard Gauge of 1893: wrought iron at 480 lb per cubic foot, weight per square foot by gauge number.",
  awg: "American Wire Gauge: d = 0.005 in × 92^((36 − n) / 39).",
};

export function gaugeTables(family?: GaugeFamily) {
  const families = family ? [family] : (Object.keys(GAUGE_FAMILY_NAMES) as GaugeFamily[]);
  return {
    data: families.map((gaugeFamily) => ({
      family: gaugeFamily,
      name: GAUGE_FAMILY_NAMES[gaugeFamily],
      definition: DEFINITIONS[gaugeFamily],
      rows: gaugeTable(gaugeFamily).map((gaugeRow) => ({
        gauge: gaugeRow.gauge,
        in: roundTo(gaugeRow.thicknessIn, 4),
        mm: roundTo(gaugeRow.thicknessMm, 3),
      })),
    })),
  };
}

const fail = (pointer: string, message: string) =>
  invalidRequest(`Cannot recommend a setup: ${message}.`, [{ location: "body", pointer, message }]);

export async function setupFor(em: EntityManager, shopId: string, req: z.infer<typeof SetupRequestSchema>) {
  const shear = await em.findOne(Shear, { id: req.shear, shop: shopId, archivedAt: null });
  if (!shear) throw fail("/shear", "no active shear with that id in this shop");
  const grade = await gradeByCode(em, shopId, req.grade);
  if (!grade) throw fail("/grade", "no active grade with that code in this shop");
  const units = req.units as LengthUnit;
  let thicknessMm: number | null;
  let gauge: number | null = null;
  if ("gauge" in req.thickness) {
    gauge = req.thickness.gauge;
    thicknessMm = grade.gaugeFamily ? gaugeThicknessMm(grade.gaugeFamily, gauge) : null;
    if (thicknessMm === null)
      throw fail(
        "/thickness/gauge",
        grade.gaugeFamily
          ? `gauge ${gauge} is not in the ${GAUGE_FAMILY_NAMES[grade.gaugeFamily]} table`
          : `grade ${grade.code} has no gauge system`,
      );
  } else {
    thicknessMm = lengthToMm(req.thickness.value, units);
  }
  const cutLengthMm = req.length !== undefined ? lengthToMm(req.length, units) : shear.bladeLengthMm;
  const shearP = shearProfile(shear);
  const gradeP = gradeProfile(grade);
  const rec = recommendSetup({ grade: gradeP, shear: shearP, thicknessMm, units, cutLengthMm });
  if (!rec) throw fail("/grade", `grade ${grade.code} has no usable tensile strength`);
  // The capacity findings come from the same checks a program gets: one full stroke of this length.
  const from = (mm: number) => roundTo(units === "mm" ? mm : mm / 25.4, 6);
  const probe = checkProgram(
    {
      grade: req.grade,
      thickness: req.thickness,
      units,
      sheet: { length: from(cutLengthMm), width: from(Math.max(4 * shear.backgaugeMinMm, 200)), count: 1 },
      cuts: [{ backgauge: from(Math.max(2 * shear.backgaugeMinMm, 100)), count: 1 }],
    },
    { shear: shearP, grade: gradeP },
  );
  return {
    thickness: probe.thickness ?? {
      value: from(thicknessMm),
      unit: units,
      source: gauge === null ? ("value" as const) : ("gauge" as const),
      gauge,
      gaugeFamily: grade.gaugeFamily ?? null,
    },
    setup: rec.setup,
    force: rec.force,
    findings: probe.findings.filter((f) => CAPACITY_CODES.has(f.code)),
  };
}

const CAPACITY_CODES = new Set([
  "thickness_over_capacity",
  "force_over_rating",
  "force_dull_blade_margin",
  "hardness_over_blade_limit",
  "gap_out_of_range",
  "rake_out_of_range",
]);
