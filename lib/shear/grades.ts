/**
 * Material grades: the demo/seed library and the strength a check uses.
 *
 * Strengths are the standards' specified minimums where a standard gives them
 * (metric values of the dual-unit standards, or the inch-pound value converted
 * where only that is given); grades whose standard sets no mandatory strength
 * carry typical values and say so (`valuesAreTypical`).
 */
import type { GradeFamily, GradeProfile } from "./types";
import { ksiToMpa } from "./units";

/**
 * Shear strength / tensile strength used when a grade states none.
 * Steels: about 0.6–0.8 of tensile (common practice); we take 0.75.
 * Wrought aluminium and copper: about 0.55–0.65 (from memory); we take 0.6.
 */
export const DEFAULT_SHEAR_TENSILE_RATIO: Readonly<Record<GradeFamily, number>> = {
  "carbon-steel": 0.75,
  "hsla-steel": 0.75,
  stainless: 0.75,
  "abrasion-resistant": 0.75,
  aluminium: 0.6,
  copper: 0.6,
};

const grade = (profile: Omit<GradeProfile, "shearTensileRatio"> & { shearTensileRatio?: number }): GradeProfile =>
  Object.freeze({
    ...profile,
    shearTensileRatio: profile.shearTensileRatio ?? DEFAULT_SHEAR_TENSILE_RATIO[profile.family],
  });

/** Demo/seed grade library. */
export const GRADE_LIBRARY: readonly GradeProfile[] = Object.freeze([
  grade({
    code: "A36",
    name: "Carbon structural steel plate",
    family: "carbon-steel",
    standard: "ASTM A36/A36M",
    yieldMpa: 250, // 36 ksi minimum
    tensileMinMpa: 400, // 58 ksi minimum
    tensileMaxMpa: 550, // 80 ksi
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: "msg",
    hardnessHb: null,
  }),
  grade({
    code: "A572-50",
    name: "High-strength low-alloy steel, Grade 50",
    family: "hsla-steel",
    standard: "ASTM A572/A572M Grade 50",
    yieldMpa: 345, // 50 ksi minimum
    tensileMinMpa: 450, // 65 ksi minimum
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: "msg",
    hardnessHb: null,
  }),
  grade({
    code: "304",
    name: "Austenitic stainless steel, Type 304",
    family: "stainless",
    standard: "ASTM A240/A240M Type 304",
    yieldMpa: 205, // 30 ksi minimum
    tensileMinMpa: 515, // 75 ksi minimum
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: "ussg",
    hardnessHb: 201, // A240 maximum for Type 304 (from memory)
  }),
  grade({
    code: "316",
    name: "Austenitic stainless steel, Type 316",
    family: "stainless",
    standard: "ASTM A240/A240M Type 316",
    yieldMpa: 205, // 30 ksi minimum
    tensileMinMpa: 515, // 75 ksi minimum
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: "ussg",
    hardnessHb: 217, // A240 maximum for Type 316 (from memory)
  }),
  grade({
    code: "5052-H32",
    name: "Aluminium alloy 5052, temper H32",
    family: "aluminium",
    standard: "ASTM B209/B209M",
    yieldMpa: 160, // 23 ksi minimum
    tensileMinMpa: 215, // 31 ksi minimum
    tensileMaxMpa: 265, // 38 ksi
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: "awg",
    hardnessHb: null,
  }),
  grade({
    code: "6061-T6",
    name: "Aluminium alloy 6061, temper T6, sheet",
    family: "aluminium",
    standard: "ASTM B209/B209M",
    yieldMpa: 240, // 35 ksi minimum
    tensileMinMpa: 290, // 42 ksi minimum
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: "awg",
    hardnessHb: null,
  }),
  grade({
    code: "C11000-H02",
    name: "Electrolytic tough pitch copper, half hard",
    family: "copper",
    standard: "ASTM B152/B152M",
    yieldMpa: null, // B152 sets no yield minimum for H02
    tensileMinMpa: ksiToMpa(37), // 37–46 ksi
    tensileMaxMpa: ksiToMpa(46),
    tensileTypicalMpa: null,
    valuesAreTypical: false,
    gaugeFamily: null, // copper sheet is ordered by weight (oz/ft²) or decimal thickness
    hardnessHb: null,
  }),
  grade({
    code: "AR400",
    name: "Abrasion-resistant plate, 400 HB class",
    family: "abrasion-resistant",
    standard: "none: no ASTM standard; sold by hardness (360–440 HB)",
    yieldMpa: null,
    tensileMinMpa: null,
    tensileTypicalMpa: ksiToMpa(180), // about 180 ksi typical
    valuesAreTypical: true,
    gaugeFamily: null,
    hardnessHb: 440, // upper end of the 360–440 HB class: the blade check takes the hardest plate
  }),
  grade({
    code: "A1011-CS",
    name: "Hot-rolled sheet, commercial steel",
    family: "carbon-steel",
    standard: "ASTM A1011/A1011M CS (no mandatory strength; typical values)",
    yieldMpa: 275, // middle of the 30–50 ksi typical range the standard prints, non-mandatory (from memory)
    tensileMinMpa: null,
    tensileTypicalMpa: 380, // about 55 ksi typical (from memory)
    valuesAreTypical: true,
    gaugeFamily: "msg",
    hardnessHb: null,
  }),
  grade({
    code: "A1008-CS",
    name: "Cold-rolled sheet, commercial steel",
    family: "carbon-steel",
    standard: "ASTM A1008/A1008M CS (no mandatory strength; typical values)",
    yieldMpa: 205, // middle of the 20–40 ksi typical range the standard prints, non-mandatory (from memory)
    tensileMinMpa: null,
    tensileTypicalMpa: 330, // about 48 ksi typical (from memory)
    valuesAreTypical: true,
    gaugeFamily: "msg",
    hardnessHb: null,
  }),
]);

const normaliseCode = (code: string): string => code.trim().toUpperCase();

/** Same grade code? Codes compare trimmed and case-insensitive. */
export const sameGradeCode = (a: string, b: string): boolean => normaliseCode(a) === normaliseCode(b);

/** Find a grade by code in a library (the seed library by default). */
export function findGrade(code: string, library: readonly GradeProfile[] = GRADE_LIBRARY): GradeProfile | null {
  return library.find((g) => sameGradeCode(g.code, code)) ?? null;
}

export interface GradeTensile {
  mpa: number;
  basis: "minimum" | "typical";
}

/** Tensile strength a check uses: the minimum, or the typical value when there is no minimum. */
export function gradeTensile(grade: GradeProfile): GradeTensile | null {
  if (isPositive(grade.tensileMinMpa))
    return { mpa: grade.tensileMinMpa, basis: grade.valuesAreTypical ? "typical" : "minimum" };
  if (isPositive(grade.tensileTypicalMpa)) return { mpa: grade.tensileTypicalMpa, basis: "typical" };
  return null;
}

/** Shear strength for the straight-blade force: tensile × shear/tensile ratio. */
export function gradeShearStrengthMpa(grade: GradeProfile): number | null {
  const tensile = gradeTensile(grade);
  const ratio = isPositive(grade.shearTensileRatio)
    ? grade.shearTensileRatio
    : DEFAULT_SHEAR_TENSILE_RATIO[grade.family];
  return tensile === null || ratio === undefined ? null : tensile.mpa * ratio;
}

function isPositive(value: number | null | undefined): value is number {
  return typeof value === "number" && Number.isFinite(value) && value > 0;
}
