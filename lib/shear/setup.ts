/**
 * Setup recommendation: blade gap (at the centre and the ends), rake, hold-down,
 * crown, backgauge retract.
 *
 * Every value says whether it was computed or given, and why, in one short
 * sentence with the rule and its inputs. Computed settings are recommendations
 * for a qualified operator; the machine's manual and local codes come first.
 */
import type { GradeFamily, GradeProfile, LengthUnit, ShearProfile } from "./types";
import type { SetupReport, SetupValue } from "./reports";
import { DULL_BLADE_FACTOR, rakeForForceDeg } from "./force";
import {
  GAP_RULES,
  computedSetting as computed,
  describeCentreAndEnds,
  describeCrown,
  givenSetting as given,
  recommendGap,
} from "./gap";
import { fmtDeg, fmtForce, fmtLength, fmtNumber, fmtStrength, DECIMALS, roundTo, showLength } from "./units";

const FAMILY_LABEL: Readonly<Record<GradeFamily, string>> = {
  aluminium: "aluminium",
  copper: "copper",
  "carbon-steel": "carbon steel",
  stainless: "stainless steel",
  "hsla-steel": "high-strength low-alloy steel",
  "abrasion-resistant": "abrasion-resistant plate",
};

/** Rake recommendations are rounded up to this step, degrees (ours: a setting an operator can dial). */
export const RAKE_STEP_DEG = 0.1;
/** Hold-down rule (ours, no published rule found): full force at this yield strength, MPa (50 ksi class). */
export const HOLD_DOWN_FULL_AT_YIELD_MPA = 345;
/** Hold-down rule (ours): never below this share of full force, %. */
export const HOLD_DOWN_MIN_PCT = 25;
/** Hold-down rule (ours): when a grade states no yield, take this share of tensile as its yield. */
export const YIELD_FROM_TENSILE_WHEN_MISSING = 0.5;
/** Backgauge retract after clamping: about 0.1 in (common practice). */
export const BACKGAUGE_RETRACT_MM = 2.54;

export interface RakeRecommendation {
  deg: number;
  /** dull: dull blades fit with margin; sharp: only sharp blades fit; over: nothing in range fits. */
  basis: "dull" | "sharp" | "over";
}

const ceilToStep = (deg: number, step: number): number => roundTo(Math.ceil(deg / step - 1e-9) * step, 6);

/**
 * Lowest rake in the shear's range, in RAKE_STEP_DEG steps, at which the
 * raked-blade force with dull blades (× DULL_BLADE_FACTOR) stays within the
 * rated force. If no rake in range gives that margin, the lowest rake at which
 * sharp blades fit; if none does, the largest rake.
 */
export function recommendRake(
  tensileMpa: number,
  thicknessMm: number,
  ratedKn: number,
  shear: ShearProfile,
): RakeRecommendation {
  const fit = (forceKn: number): number | null => {
    const deg = Math.max(
      shear.rakeMinDeg,
      ceilToStep(rakeForForceDeg(tensileMpa, thicknessMm, forceKn), RAKE_STEP_DEG),
    );
    return deg <= shear.rakeMaxDeg ? deg : null;
  };
  const dull = fit(ratedKn / DULL_BLADE_FACTOR);
  if (dull !== null) return { deg: dull, basis: "dull" };
  const sharp = fit(ratedKn);
  if (sharp !== null) return { deg: sharp, basis: "sharp" };
  return { deg: shear.rakeMaxDeg, basis: "over" };
}

export interface HoldDownRecommendation {
  pct: number;
  yieldMpa: number | null;
  yieldFrom: "yield" | "tensile" | "none";
}

/**
 * Hold-down (ours; no published rule found): share of full hold-down force
 * proportional to yield strength, full force at HOLD_DOWN_FULL_AT_YIELD_MPA,
 * between HOLD_DOWN_MIN_PCT and 100 %, rounded to whole per cent. Soft grades
 * get less; finished or coated surfaces may need less still (operator's call).
 */
export function recommendHoldDown(grade: GradeProfile, tensileMpa: number | null): HoldDownRecommendation {
  let yieldMpa: number | null = null;
  let yieldFrom: HoldDownRecommendation["yieldFrom"] = "none";
  if (grade.yieldMpa !== null && grade.yieldMpa > 0) {
    yieldMpa = grade.yieldMpa;
    yieldFrom = "yield";
  } else if (tensileMpa !== null) {
    yieldMpa = tensileMpa * YIELD_FROM_TENSILE_WHEN_MISSING;
    yieldFrom = "tensile";
  }
  const raw = yieldMpa === null ? 100 : (100 * yieldMpa) / HOLD_DOWN_FULL_AT_YIELD_MPA;
  return { pct: Math.round(Math.min(100, Math.max(HOLD_DOWN_MIN_PCT, raw))), yieldMpa, yieldFrom };
}

/** Setup values a program gives, canonical units; null = not given. */
export interface GivenSetup {
  rakeDeg: number | null;
  gapMm: number | null;
  holdDownPct: number | null;
  crownMm: number | null;
  retractMm: number | null;
}

export const NOTHING_GIVEN: GivenSetup = Object.freeze({
  rakeDeg: null,
  gapMm: null,
  holdDownPct: null,
  crownMm: null,
  retractMm: null,
});

export interface SetupInputs {
  grade: GradeProfile;
  tensileMpa: number;
  thicknessMm: number;
  shear: ShearProfile;
  ratedKn: number;
  units: LengthUnit;
  given: GivenSetup;
  /** Required (sharp-blade) force of the program at a rake, kN. */
  requiredKnAt: (rakeDeg: number) => number;
}

export interface ResolvedSetup {
  rakeDeg: number;
  gapMm: number;
  gapCentreMm: number;
  holdDownPct: number;
  crownMm: number;
  retractMm: number;
  requiredKn: number;
  report: SetupReport;
}

/** Resolve every setup value (given wins, still reported against our rule) and explain it. */
export function resolveSetup(inputs: SetupInputs): ResolvedSetup {
  const units = inputs.units;
  const rake = resolveRake(inputs);
  const requiredKn = inputs.requiredKnAt(rake.deg);
  const gap = resolveGap(inputs);
  const holdDown = resolveHoldDown(inputs);
  const crown = describeCrown(requiredKn, inputs.ratedKn, inputs.shear, units, inputs.given.crownMm);
  const centreAndEnds = describeCentreAndEnds(gap.mm, inputs.given.gapMm !== null, crown.mm, units);
  const retractMm = inputs.given.retractMm ?? BACKGAUGE_RETRACT_MM;
  const retract: SetupValue =
    inputs.given.retractMm !== null
      ? given(
          showLength(retractMm, units),
          units,
          "Given in the program; about 0.1 in is usual so the piece is not trapped.",
        )
      : computed(
          showLength(retractMm, units),
          units,
          `Back the gauge off ${fmtLength(retractMm, units)} after the hold-down clamps so the piece is not trapped (common practice).`,
        );
  return {
    rakeDeg: rake.deg,
    gapMm: gap.mm,
    gapCentreMm: centreAndEnds.centreMm,
    holdDownPct: holdDown.pct,
    crownMm: crown.mm,
    retractMm,
    requiredKn,
    report: {
      bladeGap: gap.value,
      gapEnds: centreAndEnds.ends,
      gapCentre: centreAndEnds.centre,
      rake: rake.value,
      holdDown: holdDown.value,
      crown: crown.value,
      backgaugeRetract: retract,
    },
  };
}

const rangeText = (min: string, max: string): string => `${min}–${max}`;

function resolveRake(inputs: SetupInputs): { deg: number; value: SetupValue } {
  const { shear, units } = inputs;
  const range = rangeText(fmtDeg(shear.rakeMinDeg), fmtDeg(shear.rakeMaxDeg));
  const rated = fmtForce(inputs.ratedKn, units);
  if (inputs.given.rakeDeg !== null) {
    const deg = inputs.given.rakeDeg;
    const forceKn = inputs.requiredKnAt(deg);
    const inRange = deg >= shear.rakeMinDeg && deg <= shear.rakeMaxDeg;
    const where = inRange ? `inside this shear's ${range} range` : `OUTSIDE this shear's ${range} range`;
    return {
      deg,
      value: given(
        roundTo(deg, DECIMALS.deg),
        "deg",
        `Given in the program, ${where}; the cut needs ${fmtForce(forceKn, units)} of the ${rated} rating at this rake.`,
      ),
    };
  }
  const recommendation = recommendRake(inputs.tensileMpa, inputs.thicknessMm, inputs.ratedKn, shear);
  const forceKn = inputs.requiredKnAt(recommendation.deg);
  const sharp = fmtForce(forceKn, units);
  const dull = fmtForce(forceKn * DULL_BLADE_FACTOR, units);
  const lowRake =
    " Lower rake means less twist, bow and camber of narrow strips, at the cost of force (stainless producers' fabrication guidance; common practice), so the lowest that fits is taken.";
  let why: string;
  if (recommendation.basis === "dull") {
    why = `Lowest rake in this shear's ${range} range at which even dull blades (${DULL_BLADE_FACTOR} × ${sharp} = ${dull}) stay within the ${rated} rating.`;
  } else if (recommendation.basis === "sharp") {
    why = `No rake in this shear's ${range} range keeps dull blades (${dull}) within the ${rated} rating; this is the lowest at which sharp blades (${sharp}) do.`;
  } else {
    why = `Even this shear's largest rake needs ${sharp}, over the ${rated} rating: this program cannot run on this shear.`;
  }
  if (recommendation.basis !== "over") why += lowRake;
  return { deg: recommendation.deg, value: computed(roundTo(recommendation.deg, DECIMALS.deg), "deg", why) };
}
function resolveGap(inputs: SetupInputs): { mm: number; value: SetupValue } {
  const { shear, units } = inputs;
  const family = inputs.grade.family;
  const recommendation = recommendGap(inputs.thicknessMm, family, shear);
  const range = rangeText(fmtLength(shear.gapMinMm, units), fmtLength(shear.gapMaxMm, units));
  const anchors = GAP_RULES[family];
  const rule =
    `${fmtNumber(recommendation.pct, 1)} % of the ${fmtLength(inputs.thicknessMm, units)} thickness for ${FAMILY_LABEL[family]} ` +
    `(the share changes with thickness: ${anchors.thin.pct} % at ${fmtLength(anchors.thin.thicknessMm, units)} and thinner, ${anchors.thick.pct} % at ${fmtLength(anchors.thick.thicknessMm, units)} and thicker)`;
  if (inputs.given.gapMm !== null) {
    const mm = inputs.given.gapMm;
    const inRange = mm >= shear.gapMinMm && mm <= shear.gapMaxMm;
    const where = inRange ? `inside this shear's ${range} range` : `OUTSIDE this shear's ${range} range`;
    return {
      mm,
      value: given(
        showLength(mm, units),
        units,
        `Given in the program, ${where}; our rule, ${rule}, gives ${fmtLength(recommendation.mm, units)}.`,
      ),
    };
  }
  let why: string;
  if (recommendation.clamped === "min")
    why = `${capitalise(rule)} would be ${fmtLength(recommendation.idealMm, units)}, below this shear's smallest gap, so its minimum is used.`;
  else if (recommendation.clamped === "max")
    why = `${capitalise(rule)} would be ${fmtLength(recommendation.idealMm, units)}, above this shear's largest gap, so its maximum is used.`;
  else why = `${capitalise(rule)} = ${fmtLength(recommendation.mm, units)}, inside this shear's ${range} range.`;
  return { mm: recommendation.mm, value: computed(showLength(recommendation.mm, units), units, why) };
}

const capitalise = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

function resolveHoldDown(inputs: SetupInputs): { pct: number; value: SetupValue } {
  const recommendation = recommendHoldDown(inputs.grade, inputs.tensileMpa);
  const units = inputs.units;
  if (inputs.given.holdDownPct !== null) {
    return {
      pct: inputs.given.holdDownPct,
      value: given(
        roundTo(inputs.given.holdDownPct, DECIMALS.pct),
        "%",
        `Given in the program; our rule gives ${recommendation.pct} % for this grade.`,
      ),
    };
  }
  const full = fmtStrength(HOLD_DOWN_FULL_AT_YIELD_MPA, units);
  let basis: string;
  if (recommendation.yieldFrom === "yield" && recommendation.yieldMpa !== null)
    basis = `yield ${fmtStrength(recommendation.yieldMpa, units)} against full force at ${full}`;
  else if (recommendation.yieldFrom === "tensile" && recommendation.yieldMpa !== null)
    basis = `no yield stated, half the tensile (${fmtStrength(recommendation.yieldMpa, units)}) against full force at ${full}`;
  else basis = "no strength stated, so full force";
  const why = `${recommendation.pct} % of full hold-down: ${basis}, kept within ${HOLD_DOWN_MIN_PCT}–100 % (our rule); use less on finished or coated surfaces.`;
  return { pct: recommendation.pct, value: computed(recommendation.pct, "%", why) };
}
