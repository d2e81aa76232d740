/**
 * The context a program is checked in: the shear profile and the grade's
 * catalogue entry, each cleaned (a copy with only usable fields) or reported,
 * and the program's thickness resolved through the grade's gauge system.
 */
import type { Finding, GradeProfile, ShearProfile } from "./types";
import type { ProgramRead, ThicknessRead } from "./read";
import { describe, isNonNegative, isObject, isPositive, positiveOrNull } from "./values";
import { finding } from "./findings";
import { DEFAULT_SHEAR_TENSILE_RATIO, gradeTensile, sameGradeCode, type GradeTensile } from "./grades";
import { GAUGE_FAMILY_NAMES, GAUGE_RANGES, gaugeThicknessMm } from "./gauges";
import { fmtLength, mmToIn } from "./units";

const SHEAR_POSITIVE_FIELDS = [
  "ratedThicknessMm",
  "ratedTensileMpa",
  "ratedRakeDeg",
  "bladeLengthMm",
  "strokesPerMin",
  "backgaugeSpeedMmPerS",
  "rakeMaxDeg",
  "gapMaxMm",
  "backgaugeMaxMm",
] as const;
const SHEAR_NON_NEGATIVE_FIELDS = [
  "backgaugeMinMm",
  "rakeMinDeg",
  "gapMinMm",
  "handlingSecondsPerTurn",
  "handlingSecondsPerSheet",
] as const;
/** Optional machine figures: kept when usable, else left out so the core's default applies. */
const SHEAR_OPTIONAL_NON_NEGATIVE_FIELDS = ["crownAtRatedMm", "crownBaselineMm"] as const;

/** Optional machine figures that must be more than zero. */
const SHEAR_OPTIONAL_POSITIVE_FIELDS = ["backgaugeRepeatabilityMm"] as const;

/** The shear profile if it is usable (a clean copy), else a finding. */
export function usableShear(shear: unknown, out: Finding[]): ShearProfile | null {
  if (!isObject(shear)) {
    out.push(
      finding(
        "shear_unknown",
        "/shear",
        "No shear profile was found for this program, so capacity, setup and time cannot be checked.",
      ),
    );
    return null;
  }
  const unusable = [
    ...SHEAR_POSITIVE_FIELDS.filter((field) => !isPositive(shear[field])),
    ...SHEAR_NON_NEGATIVE_FIELDS.filter((field) => !isNonNegative(shear[field])),
  ];
  if (unusable.length > 0) {
    out.push(
      finding(
        "shear_unknown",
        "/shear",
        `The shear profile is incomplete (${unusable.join(", ")}), so capacity, setup and time cannot be checked.`,
      ),
    );
    return null;
  }
  const clean: Partial<ShearProfile> = {};
  // every one of these was found a usable number just above
  for (const field of [...SHEAR_POSITIVE_FIELDS, ...SHEAR_NON_NEGATIVE_FIELDS]) clean[field] = shear[field] as number;
  clean.maxBladeHardnessHb = isPositive(shear.maxBladeHardnessHb) ? shear.maxBladeHardnessHb : null;
  for (const field of SHEAR_OPTIONAL_NON_NEGATIVE_FIELDS) {
    const value = shear[field];
    if (isNonNegative(value)) clean[field] = value;
  }
  for (const field of SHEAR_OPTIONAL_POSITIVE_FIELDS) {
    const value = shear[field];
    if (isPositive(value)) clean[field] = value;
  }
  if (isObject(shear.gradeThicknessLimitsMm)) {
    const limits: Record<string, number> = {};
    for (const [code, mm] of Object.entries(shear.gradeThicknessLimitsMm)) if (isPositive(mm)) limits[code] = mm;
    clean.gradeThicknessLimitsMm = limits;
  }
  return clean as ShearProfile; // every required field was copied above
}

const GRADE_FAMILIES: ReadonlySet<unknown> = new Set([
  "carbon-steel",
  "hsla-steel",
  "stainless",
  "aluminium",
  "copper",
  "abrasion-resistant",
]);
const GAUGE_FAMILIES: ReadonlySet<unknown> = new Set(["msg", "galvanized", "ussg", "awg"]);

/** The grade's catalogue entry if it is the program's grade (a clean copy), else a finding. */
export function resolveGrade(code: string | null, grade: unknown, out: Finding[]): GradeProfile | null {
  if (code === null) return null;
  if (!isObject(grade)) {
    out.push(finding("grade_unknown", "/grade", `Grade "${code}" is not in the catalogue.`));
    return null;
  }
  if (typeof grade.code !== "string" || !sameGradeCode(grade.code, code)) {
    out.push(
      finding(
        "grade_unknown",
        "/grade",
        `The program names grade "${code}" but the catalogue entry given is for ${describe(grade.code)}.`,
      ),
    );
    return null;
  }
  if (!GRADE_FAMILIES.has(grade.family)) {
    out.push(
      finding(
        "grade_incomplete",
        "/grade",
        `The catalogue entry for ${grade.code} has no known material family, so it cannot be checked.`,
      ),
    );
    return null;
  }
  const family = grade.family as GradeProfile["family"];
  return {
    code: grade.code,
    family,
    standard: typeof grade.standard === "string" ? grade.standard : "",
    yieldMpa: positiveOrNull(grade.yieldMpa),
    tensileMinMpa: positiveOrNull(grade.tensileMinMpa),
    tensileTypicalMpa: positiveOrNull(grade.tensileTypicalMpa),
    tensileMaxMpa: positiveOrNull(grade.tensileMaxMpa),
    valuesAreTypical: grade.valuesAreTypical === true,
    shearTensileRatio: isPositive(grade.shearTensileRatio)
      ? grade.shearTensileRatio
      : DEFAULT_SHEAR_TENSILE_RATIO[family],
    gaugeFamily: GAUGE_FAMILIES.has(grade.gaugeFamily) ? (grade.gaugeFamily as GradeProfile["gaugeFamily"]) : null,
    hardnessHb: positiveOrNull(grade.hardnessHb),
  };
}

/** The tensile strength a check uses, else a `grade_incomplete` finding. */
export function resolveTensile(grade: GradeProfile | null, out: Finding[]): GradeTensile | null {
  if (grade === null) return null;
  const tensile = gradeTensile(grade);
  if (tensile === null)
    out.push(
      finding(
        "grade_incomplete",
        "/grade",
        `Grade ${grade.code} has no tensile strength in the catalogue, so force and capacity cannot be checked.`,
      ),
    );
  return tensile;
}

/** Thickness in mm: the value given, or the gauge resolved in the grade's gauge system. */
export function resolveThickness(
  thickness: ThicknessRead | null,
  grade: GradeProfile | null,
  gradeCode: string | null,
  out: Finding[],
): number | null {
  if (thickness === null) return null;
  if (thickness.kind === "value") return thickness.mm;
  if (grade === null) {
    out.push(
      finding(
        "gauge_unknown",
        thickness.pointer,
        `Gauge ${thickness.gauge} cannot be resolved because the grade${gradeCode ? ` "${gradeCode}"` : ""} is unknown.`,
        null,
        thickness.gauge,
        "gauge",
      ),
    );
    return null;
  }
  const family = grade.gaugeFamily;
  if (family === null) {
    out.push(
      finding(
        "gauge_unknown",
        thickness.pointer,
        `${grade.code} has no gauge system; give the thickness as a value.`,
        null,
        thickness.gauge,
        "gauge",
      ),
    );
    return null;
  }
  const mm = gaugeThicknessMm(family, thickness.gauge);
  if (mm === null) {
    const range = GAUGE_RANGES[family];
    const message = `Gauge ${thickness.gauge} is not defined in the ${GAUGE_FAMILY_NAMES[family]} used for ${grade.code} (whole numbers ${range.min} to ${range.max}).`;
    out.push(finding("gauge_unknown", thickness.pointer, message, null, thickness.gauge, "gauge"));
  }
  return mm;
}

/**
 * Inch programs whose sizes look like millimetres (ours): a sheet edge more than
 * UNITS_SUSPECT_FACTOR × the blade length in inches, or a thickness more than
 * that many times the rated thickness, that would fit if read as millimetres.
 */
export const UNITS_SUSPECT_FACTOR = 4;

export function checkUnitsSuspect(program: ProgramRead, shear: ShearProfile): Finding[] {
  if (program.units !== "in") return [];
  const looksMm = (raw: number, limitMm: number): boolean =>
    raw > UNITS_SUSPECT_FACTOR * mmToIn(limitMm) && raw <= limitMm;
  const thickness = program.thickness;
  let what: string | null = null;
  if (program.sheet !== null && looksMm(program.sheet.rawLength, shear.bladeLengthMm)) {
    what = `a ${program.sheet.rawLength} in sheet edge is far longer than the ${fmtLength(shear.bladeLengthMm, "in")} blade`;
  } else if (thickness !== null && thickness.kind === "value" && looksMm(thickness.raw, shear.ratedThicknessMm)) {
    what = `a ${thickness.raw} in thickness is far over the ${fmtLength(shear.ratedThicknessMm, "in")} rating`;
  }
  if (what === null) return [];
  return [
    finding(
      "units_suspect",
      "/units",
      `The program is in inches, but ${what}; read as millimetres it would fit. Check "units".`,
    ),
  ];
}
