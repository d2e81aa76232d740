/**
 * Findings: the stable list of codes, and the checks that raise them.
 *
 * A finding has a stable `code`, a `severity` fixed by the code (`error`
 * blocks release, `warning` needs acknowledgement), a plain-words `message`,
 * a JSON pointer into the submitted program, and `limit` / `actual` in the
 * caller's units. Checks report; they never change the program.
 */
import type { Finding, FindingCode, GradeProfile, LengthUnit, Severity, ShearProfile, Validation } from "./types";
import type { FlowCut, FlowResult } from "./flow";
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
  units_inconsistent: { severity: "error", meaning: "`units` is missing or not `in`/`mm`, or two fields give the same value in different units and disagree." },
  units_suspect: { severity: "warning", meaning: "An inch program's sheet edge or thickness is more than 4 × the shear's limit but would fit if read as millimetres: `units` may be wrong." },
  value_invalid: { severity: "error", meaning: "A field is missing, of the wrong type, or outside its domain (e.g. a length that is not a positive number)." },
  shear_unknown: { severity: "error", meaning: "No usable shear profile was given; capacity, setup and time cannot be checked." },
  grade_unknown: { severity: "error", meaning: "The program's grade is not in the catalogue (or the catalogue entry given is for another grade)." },
  grade_incomplete: { severity: "error", meaning: "The grade has no tensile strength, so force and capacity cannot be checked." },
  gauge_unknown: { severity: "error", meaning: "The gauge number is not defined in the grade's gauge system, or the grade has none." },
  thickness_over_capacity: { severity: "error", meaning: "The thickness is over this shear's maximum for the grade (per-grade limit of the shear, or derived from its rating)." },
  force_over_rating: { severity: "error", meaning: "At the chosen rake, the force the cut needs (sharp blades) is over the shear's rated force." },
  force_dull_blade_margin: { severity: "warning", meaning: "Sharp blades fit, but dull blades (1.5 × the force) would be over the rated force." },
  hardness_over_blade_limit: { severity: "error", meaning: "The grade can be harder than the shear's blades are made for." },
  cut_length_over_blade: { severity: "error", meaning: "A group's length of cut is longer than the blade." },
  cut_length_over_workpiece: { severity: "error", meaning: "A group's given length of cut is longer than the edge it presents to the blade." },
  partial_stroke: { severity: "warning", meaning: "A group's length of cut is shorter than the presented edge: its strokes do not cut pieces off, so none are counted." },
  backgauge_out_of_travel: { severity: "error", meaning: "A backgauge setting is outside the shear's backgauge travel." },
  backgauge_beyond_workpiece: { severity: "error", meaning: "A stroke's backgauge is not smaller than the workpiece left: the stroke cuts nothing." },
  group_cuts_nothing: { severity: "error", meaning: "A group has no strokes or nothing to run on." },
  program_cuts_nothing: { severity: "error", meaning: "The program has no cut groups." },
  gap_out_of_range: { severity: "error", meaning: "The given blade gap is outside the shear's gap range." },
  rake_out_of_range: { severity: "error", meaning: "The given rake is outside the shear's rake range." },
  strip_narrow: { severity: "warning", meaning: "Strips narrow for their thickness or length tend to twist and bow (our rule: narrower than 10 × thickness or 1/50 of their length)." },
});

/** Narrow strip rule (ours): warn below this many thicknesses of width… */
export const NARROW_STRIP_WIDTH_PER_THICKNESS = 10;
/** …or when the strip is longer than this many widths. */
export const NARROW_STRIP_LENGTH_PER_WIDTH = 50;

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

const groupName = (i: number): string => `group ${i + 1}`;
const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

export function checkThickness(thicknessMm: number, max: MaxThickness, gradeCode: string, pointer: string, u: LengthUnit): Finding[] {
  if (thicknessMm <= max.mm) return [];
  const why = max.source === "shear-profile" ? "the limit this shear sets for the grade" : "derived from its rating at the rated rake";
  return [
    finding(
      "thickness_over_capacity",
      pointer,
      `Thickness ${fmtLength(thicknessMm, u)} is more than this shear can cut in ${gradeCode}: at most ${fmtLength(max.mm, u)} (${why}).`,
      showLength(max.mm, u),
      showLength(thicknessMm, u),
      u,
    ),
  ];
}

export function checkForce(requiredKn: number, ratedKn: number, rakeDeg: number, pointer: string, u: LengthUnit): Finding[] {
  const unit = forceUnitFor(u);
  if (requiredKn > ratedKn) {
    return [
      finding(
        "force_over_rating",
        pointer,
        `At ${fmtDeg(rakeDeg)} rake the cut needs ${fmtForce(requiredKn, u)}, more than this shear's ${fmtForce(ratedKn, u)} rating.`,
        showForce(ratedKn, u),
        showForce(requiredKn, u),
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
        `With dull blades the cut may need ${fmtForce(dull, u)} (${DULL_BLADE_FACTOR} × ${fmtForce(requiredKn, u)}), more than the ${fmtForce(ratedKn, u)} rating: run only with sharp blades.`,
        showForce(ratedKn, u),
        showForce(dull, u),
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
  show: (v: number) => number,
  text: (v: number) => string,
  unit: string,
): Finding[] {
  if (value >= min && value <= max) return [];
  const bound = value < min ? min : max;
  return [finding(code, pointer, `${what} ${text(value)} is outside this shear's ${text(min)}–${text(max)} range.`, show(bound), show(value), unit)];
}

export function checkGivenSetup(given: GivenSetup, gapPointer: string, shear: ShearProfile, u: LengthUnit): Finding[] {
  const out: Finding[] = [];
  if (given.gapMm !== null) {
    out.push(...rangeFinding("gap_out_of_range", gapPointer, "Blade gap", given.gapMm, shear.gapMinMm, shear.gapMaxMm, (v) => showLength(v, u), (v) => fmtLength(v, u), u));
  }
  if (given.rakeDeg !== null) {
    out.push(...rangeFinding("rake_out_of_range", "/setup/rakeDeg", "Rake", given.rakeDeg, shear.rakeMinDeg, shear.rakeMaxDeg, (v) => roundTo(v, DECIMALS.deg), fmtDeg, "deg"));
  }
  return out;
}

export interface FlowCheckInput {
  flow: FlowResult;
  cuts: readonly FlowCut[];
  /** Cuts whose fields were invalid (already reported); skipped here. */
  skip: readonly boolean[];
  shear: ShearProfile | null;
  thicknessMm: number | null;
  units: LengthUnit;
}

/** Where a group's presented edge comes from: the sheet's length, its width (first group turned), or an earlier group. */
function presentedEdgePointer(cuts: readonly FlowCut[], index: number): string {
  for (let i = 1; i <= index; i++) if (cuts[i].turn) return `/cuts/${index}`;
  return cuts[0]?.turn ? "/sheet/width" : "/sheet/length";
}

/** Checks of every group against the shear and the piece flow. */
export function checkGroups(c: FlowCheckInput): Finding[] {
  const out: Finding[] = [];
  const u = c.units;
  if (c.cuts.length === 0) {
    out.push(finding("program_cuts_nothing", "/cuts", "The program has no cut groups, so it cuts nothing."));
    return out;
  }
  for (const g of c.flow.groups) {
    const i = g.index;
    if (c.skip[i]) continue;
    const cut = c.cuts[i];
    const at = `/cuts/${i}`;
    // A group of 0 strokes only names the remnant as its piece: the backgauge is not set for it.
    if (c.shear && cut.count > 0) out.push(...checkBackgaugeTravel(cut, i, c.shear, u));
    if (cut.count === 0 && g.pieces.length === 0) {
      out.push(finding("group_cuts_nothing", `${at}/count`, `${capital(groupName(i))} has nothing to cut: its count is 0.`, null, 0, "strokes"));
      continue;
    }
    if (g.workpieces === 0) {
      const source = cut.from ?? i - 1;
      const reason = cut.turn ? `group ${source + 1} left no pieces to turn` : "the groups before it used up the workpiece";
      out.push(finding("group_cuts_nothing", at, `${capital(groupName(i))} has nothing to cut: ${reason}.`, null, 0, "workpieces"));
      continue;
    }
    if (c.shear && g.cutLengthMm > c.shear.bladeLengthMm) {
      const pointer = cut.lengthMm !== null ? `${at}/length` : presentedEdgePointer(c.cuts, i);
      out.push(
        finding(
          "cut_length_over_blade",
          pointer,
          `${capital(groupName(i))} cuts ${fmtLength(g.cutLengthMm, u)}, longer than this shear's ${fmtLength(c.shear.bladeLengthMm, u)} blade.`,
          showLength(c.shear.bladeLengthMm, u),
          showLength(g.cutLengthMm, u),
          u,
        ),
      );
    }
    if (g.lengthOverWorkpiece && cut.lengthMm !== null) {
      out.push(
        finding(
          "cut_length_over_workpiece",
          `${at}/length`,
          `${capital(groupName(i))} gives a length of cut of ${fmtLength(cut.lengthMm, u)}, longer than the ${fmtLength(g.presentedEdgeMm, u)} edge it presents to the blade.`,
          showLength(g.presentedEdgeMm, u),
          showLength(cut.lengthMm, u),
          u,
        ),
      );
    }
    if (g.partial && cut.lengthMm !== null) {
      out.push(
        finding(
          "partial_stroke",
          `${at}/length`,
          `${capital(groupName(i))} cuts ${fmtLength(cut.lengthMm, u)} of a ${fmtLength(g.presentedEdgeMm, u)} edge: these strokes do not cut a piece off, so no pieces are counted from them.`,
          showLength(g.presentedEdgeMm, u),
          showLength(cut.lengthMm, u),
          u,
        ),
      );
    }
    if (g.beyond !== null) {
      const b = g.beyond;
      out.push(
        finding(
          "backgauge_beyond_workpiece",
          `${at}/backgauge`,
          `In ${groupName(i)}, stroke ${b.firstStroke} is set at ${fmtLength(cut.backgaugeMm, u)} but only ${fmtLength(b.remainingMm, u)} of workpiece is left: ${plural(b.strokes, "stroke", "strokes")} per sheet cut nothing.`,
          showLength(b.remainingMm, u),
          showLength(cut.backgaugeMm, u),
          u,
        ),
      );
    }
    if (!cut.scrap && g.pieces.length > 0) out.push(...checkNarrowStrip(cut, g.presentedEdgeMm, i, c.thicknessMm, u));
  }
  return out;
}

function checkBackgaugeTravel(cut: FlowCut, i: number, shear: ShearProfile, u: LengthUnit): Finding[] {
  const bg = cut.backgaugeMm;
  if (bg >= shear.backgaugeMinMm && bg <= shear.backgaugeMaxMm) return [];
  const bound = bg < shear.backgaugeMinMm ? shear.backgaugeMinMm : shear.backgaugeMaxMm;
  return [
    finding(
      "backgauge_out_of_travel",
      `/cuts/${i}/backgauge`,
      `Backgauge ${fmtLength(bg, u)} in ${groupName(i)} is outside this shear's ${fmtLength(shear.backgaugeMinMm, u)}–${fmtLength(shear.backgaugeMaxMm, u)} travel.`,
      showLength(bound, u),
      showLength(bg, u),
      u,
    ),
  ];
}

/** Narrow strip (ours): width under 10 × thickness, or length over 50 × width. */
function checkNarrowStrip(cut: FlowCut, lengthMm: number, i: number, thicknessMm: number | null, u: LengthUnit): Finding[] {
  const minWidth = Math.max(thicknessMm === null ? 0 : NARROW_STRIP_WIDTH_PER_THICKNESS * thicknessMm, lengthMm / NARROW_STRIP_LENGTH_PER_WIDTH);
  if (cut.backgaugeMm >= minWidth) return [];
  const of = thicknessMm === null ? "" : ` of ${fmtLength(thicknessMm, u)} material`;
  return [
    finding(
      "strip_narrow",
      `/cuts/${i}/backgauge`,
      `${capital(groupName(i))} cuts strips ${fmtLength(cut.backgaugeMm, u)} wide and ${fmtLength(lengthMm, u)} long${of}; strips narrower than ${fmtLength(minWidth, u)} tend to twist and bow.`,
      showLength(minWidth, u),
      showLength(cut.backgaugeMm, u),
      u,
    ),
  ];
}

const capital = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);
