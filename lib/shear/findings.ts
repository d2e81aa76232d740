/**
 * Findings: the stable list of codes, and the checks that raise them.
 *
 * A finding has a stable `code`, a `severity` fixed by the code (`error`
 * blocks release, `warning` needs acknowledgement), a plain-words `message`,
 * a JSON pointer into the submitted program, and `limit` / `actual` in the
 * caller's units. Checks report; they never change the program.
 */
import type { Finding, FindingCode, GradeProfile, LengthUnit, Severity, ShearProfile, Validation } from "./types";
import type { GivenSetup } from "./setup";
import type { MaxThickness } from "./force";
import { DULL_BLADE_FACTOR } from "./force";
import { DECIMALS, fmtDeg, fmtForce, fmtLength, roundTo, showForce, showLength, forceUnitFor } from "./units";

export interface FindingSpec {
  severity: Severity;
  meaning: string;
}

/** Every finding code, its severity and what it means. Codes are stable: never renamed or reused. */
export const FINDING_CATALOGUE: Readonly<Record<FindingCode, FindingSpec>> = Object.freeze({
  units_inconsistent: {
    severity: "error",
    meaning: "`units` is missing or not `in`/`mm`, or two fields give the same value in different units and disagree.",
  },
  units_suspect: {
    severity: "warning",
    meaning:
      "An inch program's sheet edge or thickness is more than 4 × the shear's limit but would fit if read as millimetres: `units` may be wrong.",
  },
  value_invalid: {
    severity: "error",
    meaning:
      "A field is missing, of the wrong type, or outside its domain (e.g. a length that is not a positive number).",
  },
  shear_unknown: {
    severity: "error",
    meaning: "No usable shear profile was given; capacity, setup and time cannot be checked.",
  },
  grade_unknown: {
    severity: "error",
    meaning: "The program's grade is not in the catalogue (or the catalogue entry given is for another grade).",
  },
  grade_incomplete: {
    severity: "error",
    meaning: "The grade has no tensile strength, so force and capacity cannot be checked.",
  },
  gauge_unknown: {
    severity: "error",
    meaning: "The gauge number is not defined in the grade's gauge system, or the grade has none.",
  },
  thickness_over_capacity: {
    severity: "error",
    meaning:
      "The thickness is over this shear's maximum for the grade (per-grade limit of the shear, or derived from its rating).",
  },
  force_over_rating: {
    severity: "error",
    meaning: "At the chosen rake, the force the cut needs (sharp blades) is over the shear's rated force.",
  },
  force_dull_blade_margin: {
    severity: "warning",
    meaning: "Sharp blades fit, but dull blades (1.5 × the force) would be over the rated force.",
  },
  hardness_over_blade_limit: {
    severity: "error",
    meaning: "The grade can be harder than the shear's blades are made for.",
  },
  cut_length_over_blade: { severity: "error", meaning: "A group's length of cut is longer than the blade." },
  cut_length_over_workpiece: {
    severity: "error",
    meaning: "A group's given length of cut is longer than the edge it presents to the blade.",
  },
  partial_stroke: {
    severity: "warning",
    meaning:
      "A group's length of cut is shorter than the presented edge: its strokes do not cut pieces off, so none are counted.",
  },
  backgauge_out_of_travel: {
    severity: "error",
    meaning: "A backgauge setting is outside the shear's backgauge travel.",
  },
  backgauge_beyond_workpiece: {
    severity: "error",
    meaning: "A stroke's backgauge is not smaller than the workpiece left: the stroke cuts nothing.",
  },
  group_cuts_nothing: { severity: "error", meaning: "A group has no strokes or nothing to run on." },
  program_cuts_nothing: { severity: "error", meaning: "The program has no cut groups." },
  gap_out_of_range: { severity: "error", meaning: "The given blade gap is outside the shear's gap range." },
  rake_out_of_range: { severity: "error", meaning: "The given rake is outside the shear's rake range." },
  strip_narrow: {
    severity: "warning",
    meaning:
      "Strips narrow for their thickness or length tend to twist and bow (our rule: narrower than 10 × thickness or 1/50 of their length).",
  },
  strip_distortion: {
    severity: "warning",
    meaning:
      "Strips narrow for their thickness at this rake are likely to twist, bow and curve (camber); a lower rake reduces it at the cost of force (our rule: narrower than 20 × thickness × rake in degrees).",
  },
  backgauge_finer_than_repeatability: {
    severity: "warning",
    meaning:
      "Two backgauge settings differ by less than the shear's stated backgauge repeatability: the machine cannot hold the difference, so the pieces may come out the same.",
  },
});

export function finding(
  code: FindingCode,
  pointer: string,
  message: string,
  limit: number | null = null,
  actual: number | null = null,
  unit: string | null = null,
): Finding {
  return { code, severity: FINDING_CATALOGUE[code].severity, message, pointer, limit, actual, unit };
}

/** fail when any error, warn when any warning, else pass. */
export function validationOf(findings: readonly Finding[]): Validation {
  if (findings.some((f) => f.severity === "error")) return "fail";
  return findings.length > 0 ? "warn" : "pass";
}

export function checkThickness(
  thicknessMm: number,
  max: MaxThickness,
  gradeCode: string,
  pointer: string,
  units: LengthUnit,
): Finding[] {
  if (thicknessMm <= max.mm) return [];
  const why =
    max.source === "shear-profile"
      ? "the limit this shear sets for the grade"
      : "derived from its rating at the rated rake";
  return [
    finding(
      "thickness_over_capacity",
      pointer,
      `Thickness ${fmtLength(thicknessMm, units)} is more than this shear can cut in ${gradeCode}: at most ${fmtLength(max.mm, units)} (${why}).`,
      showLength(max.mm, units),
      showLength(thicknessMm, units),
      units,
    ),
  ];
}

export function checkForce(
  requiredKn: number,
  ratedKn: number,
  rakeDeg: number,
  pointer: string,
  units: LengthUnit,
): Finding[] {
  const unit = forceUnitFor(units);
  if (requiredKn > ratedKn) {
    return [
      finding(
        "force_over_rating",
        pointer,
        `At ${fmtDeg(rakeDeg)} rake the cut needs ${fmtForce(requiredKn, units)}, more than this shear's ${fmtForce(ratedKn, units)} rating.`,
        showForce(ratedKn, units),
        showForce(requiredKn, units),
        unit,
      ),
    ];
  }
  const dull = requiredKn * DULL_BLADE_FACTOR;
  if (dull > ratedKn) {
    return [
      finding(
        "force_dull_blade_margin",
        pointer,
        `With dull blades the cut may need ${fmtForce(dull, units)} (${DULL_BLADE_FACTOR} × ${fmtForce(requiredKn, units)}), more than the ${fmtForce(ratedKn, units)} rating: run only with sharp blades.`,
        showForce(ratedKn, units),
        showForce(dull, units),
        unit,
      ),
    ];
  }
  return [];
}

export function checkHardness(grade: GradeProfile, shear: ShearProfile): Finding[] {
  const max = shear.maxBladeHardnessHb;
  if (max === null || max === undefined || grade.hardnessHb === null || grade.hardnessHb <= max) return [];
  return [
    finding(
      "hardness_over_blade_limit",
      "/grade",
      `${grade.code} can be up to ${grade.hardnessHb} HB; this shear's blades are made for material up to ${max} HB.`,
      max,
      grade.hardnessHb,
      "HB",
    ),
  ];
}

/** Range check of a given setup value; `limit` is the bound it breaks. */
function rangeFinding(
  code: "gap_out_of_range" | "rake_out_of_range",
  pointer: string,
  what: string,
  value: number,
  min: number,
  max: number,
  show: (value: number) => number,
  text: (value: number) => string,
  unit: string,
): Finding[] {
  if (value >= min && value <= max) return [];
  const bound = value < min ? min : max;
  return [
    finding(
      code,
      pointer,
      `${what} ${text(value)} is outside this shear's ${text(min)}–${text(max)} range.`,
      show(bound),
      show(value),
      unit,
    ),
  ];
}

export function checkGivenSetup(
  given: GivenSetup,
  gapPointer: string,
  shear: ShearProfile,
  units: LengthUnit,
): Finding[] {
  const out: Finding[] = [];
  if (given.gapMm !== null) {
    out.push(
      ...rangeFinding(
        "gap_out_of_range",
        gapPointer,
        "Blade gap",
        given.gapMm,
        shear.gapMinMm,
        shear.gapMaxMm,
        (value) => showLength(value, units),
        (value) => fmtLength(value, units),
        units,
      ),
    );
  }
  if (given.rakeDeg !== null) {
    out.push(
      ...rangeFinding(
        "rake_out_of_range",
        "/setup/rakeDeg",
        "Rake",
        given.rakeDeg,
        shear.rakeMinDeg,
        shear.rakeMaxDeg,
        (value) => roundTo(value, DECIMALS.deg),
        fmtDeg,
        "deg",
      ),
    );
  }
  return out;
}
