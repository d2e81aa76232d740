/**
 * Blade gap (clearance between the upper and lower blade) by material family
 * and thickness, and the gap at the centre of the blade and at its ends.
 *
 * One fixed percentage per family cannot hold over the whole range: published
 * gap guidance changes the share of thickness with thickness (for steels and
 * light alloys it falls as material gets thicker; the stainless producers'
 * guidance has thin gauge tighter, 3 %, and 16 gauge and heavier at 5 %).
 * Each family has a thin and a thick anchor (thickness, % of
 * thickness), each with its source; between them the percentage is
 * interpolated on the logarithm of thickness (so equal ratios of thickness
 * move it by equal steps), and outside them it stays at the nearer anchor.
 * The result is clamped to the shear's gap range by `recommendGap`.
 */
import type { GradeFamily, LengthUnit, ShearProfile } from "./types";
import type { SetupValue } from "./reports";
import { fmtLength, fmtPct, inToMm, showLength } from "./units";

export interface GapAnchor {
  thicknessMm: number;
  /** Gap as a percentage of thickness at this thickness. */
  pct: number;
  /** Where the value comes from: a published source, `common practice` or `from memory`. */
  source: string;
}

export interface GapRule {
  thin: GapAnchor;
  thick: GapAnchor;
}

/**
 * Gap anchors by family. Checks against the published figures are in
 * tests/shear/gap.test.ts; lib/shear/README.md lists the same table.
 */
export const GAP_RULES: Readonly<Record<GradeFamily, GapRule>> = Object.freeze({
  "carbon-steel": {
    // 7 %: a shear-blade maker's published general rule when the machine's own chart is not at hand (common practice as a default).
    thin: {
      thicknessMm: 1.0,
      pct: 7,
      source: "a shear-blade maker's general rule of 7 % of thickness (common practice)",
    },
    // About 5 % on half-inch plate: from memory of shear makers' gap charts. Checked against the same blade maker's
    // mild-steel clearance chart, which gives 0.005–0.009 in for 10 gauge (0.1345 in) and at least 0.007 in for 3/16 in.
    thick: { thicknessMm: 12.7, pct: 5, source: "from memory (shear makers' gap charts for mild-steel plate)" },
  },
  stainless: {
    // The stainless producers' association's fabrication guidance (Specialty Steel Industry of North America,
    // "Stainless Steel Fabrication"): 3 % of thickness below 16 gauge, 5 % at 16 gauge (0.0625 in) and heavier;
    // 0.001–0.002 in on thin-gauge sheet. The step is ramped over the one gauge between 18 and 16 gauge (ours).
    thin: {
      thicknessMm: 1.27,
      pct: 3,
      source: "stainless producers' fabrication guidance (SSINA): 3 % below 16 gauge",
    },
    thick: {
      thicknessMm: 1.5875,
      pct: 5,
      source: "stainless producers' fabrication guidance (SSINA): 5 % at 16 gauge and heavier",
    },
  },
  aluminium: {
    // Soft aluminium and copper sit at the low end of the 4–10 % span (common practice).
    thin: { thicknessMm: 1.0, pct: 5, source: "common practice (low end of 4–10 %)" },
    thick: { thicknessMm: 6.35, pct: 4, source: "from memory (low end of 4–10 % on plate)" },
  },
  copper: {
    thin: { thicknessMm: 1.0, pct: 5, source: "common practice (low end of 4–10 %)" },
    thick: { thicknessMm: 6.35, pct: 4, source: "from memory (low end of 4–10 % on plate)" },
  },
  "hsla-steel": {
    // A plate maker's shearing guidance: 9–12 % of thickness for 65 ksi plate (its worked example is 3/8 in plate).
    thin: {
      thicknessMm: 2.0,
      pct: 12,
      source: "a plate maker's shearing guidance, 9–12 % for 65 ksi plate (upper end for sheet: ours)",
    },
    thick: {
      thicknessMm: 9.525,
      pct: 10,
      source: "a plate maker's shearing guidance, 9–12 % for 65 ksi plate, 3/8 in",
    },
  },
  "abrasion-resistant": {
    // The same plate maker: 16–18 % of thickness for 181 ksi (abrasion-resistant class) plate.
    thin: {
      thicknessMm: 3.0,
      pct: 18,
      source: "a plate maker's shearing guidance, 16–18 % for 181 ksi plate (upper end for thinner plate: ours)",
    },
    thick: {
      thicknessMm: 9.525,
      pct: 16,
      source: "a plate maker's shearing guidance, 16–18 % for 181 ksi plate, 3/8 in",
    },
  },
});

/** Gap as a percentage of thickness for a family at a thickness (log-thickness interpolation between the anchors). */
export function gapPctFor(thicknessMm: number, family: GradeFamily): number {
  const rule = GAP_RULES[family];
  if (!(thicknessMm > rule.thin.thicknessMm)) return rule.thin.pct;
  if (thicknessMm >= rule.thick.thicknessMm) return rule.thick.pct;
  const share =
    Math.log(thicknessMm / rule.thin.thicknessMm) / Math.log(rule.thick.thicknessMm / rule.thin.thicknessMm);
  return rule.thin.pct + share * (rule.thick.pct - rule.thin.pct);
}

export interface GapRecommendation {
  mm: number;
  /** The rule's gap before clamping to the shear's range. */
  idealMm: number;
  pct: number;
  clamped: "min" | "max" | null;
}

/** Gap = the family's percentage at this thickness × thickness, clamped to the shear's gap range. */
export function recommendGap(thicknessMm: number, family: GradeFamily, shear: ShearProfile): GapRecommendation {
  const pct = gapPctFor(thicknessMm, family);
  const idealMm = (pct / 100) * thicknessMm;
  if (idealMm < shear.gapMinMm) return { mm: shear.gapMinMm, idealMm, pct, clamped: "min" };
  if (idealMm > shear.gapMaxMm) return { mm: shear.gapMaxMm, idealMm, pct, clamped: "max" };
  return { mm: idealMm, idealMm, pct, clamped: null };
}

// ---------------------------------------------------------------------------
// Gap at the centre and at the ends (crown)
// ---------------------------------------------------------------------------

/**
 * Ends-minus-centre gap with no load, when the shear profile gives none, mm:
 * 0.002 in. A US Navy shipfitter training manual (NAVEDTRA 14119, the drop
 * shear) sets the knives 0.002 in closer at the centre than at the ends "to
 * allow for flexing of the knives during shearing" (0.010 in at the first and
 * last hold-downs, 0.008 in at the centre); a mechanical squaring shear
 * maker's manual gives 0.001 in less at the centre. Both are fixed settings,
 * the same for every job, so they are the baseline: blades and their seats are
 * never perfectly straight, and a moving beam on a pivot or inclined guides
 * does not pass the fixed blade at one distance along its length.
 */
export const DEFAULT_CROWN_BASELINE_MM = inToMm(0.002);
/** Force-proportional crown at full rated force when the profile gives none, mm (ours, a placeholder: set it from the machine's manual). */
export const DEFAULT_CROWN_AT_RATED_MM = 0.2;

export interface CrownRecommendation {
  /** Ends minus centre, mm. */
  mm: number;
  baselineMm: number;
  /** The part proportional to the force of the cut (ram and bed deflection under load). */
  forceMm: number;
  baselineFromProfile: boolean;
  atRatedMm: number;
  atRatedFromProfile: boolean;
  /** Share of the rated force the cut uses, %. */
  forceSharePct: number;
}

const usableFigure = (value: number | null | undefined): value is number =>
  typeof value === "number" && Number.isFinite(value) && value >= 0;

/**
 * Crown = baseline + crown at rated force × required / rated. Under load the
 * ram (upper beam) and the bed bow apart between their supports, opening the
 * gap most at mid-length, in proportion to the force (common practice);
 * setting the centre tighter by that much gives an even gap while cutting.
 */
export function recommendCrown(requiredKn: number, ratedKn: number, shear: ShearProfile): CrownRecommendation {
  const baselineFromProfile = usableFigure(shear.crownBaselineMm);
  const atRatedFromProfile = usableFigure(shear.crownAtRatedMm);
  const baselineMm = baselineFromProfile ? (shear.crownBaselineMm as number) : DEFAULT_CROWN_BASELINE_MM;
  const atRatedMm = atRatedFromProfile ? (shear.crownAtRatedMm as number) : DEFAULT_CROWN_AT_RATED_MM;
  const share = ratedKn > 0 && Number.isFinite(requiredKn) ? Math.max(0, requiredKn / ratedKn) : 0;
  const forceMm = atRatedMm * share;
  return {
    mm: baselineMm + forceMm,
    baselineMm,
    forceMm,
    baselineFromProfile,
    atRatedMm,
    atRatedFromProfile,
    forceSharePct: 100 * share,
  };
}

/** The crown alone, mm (ends minus centre). */
export const recommendCrownMm = (requiredKn: number, ratedKn: number, shear: ShearProfile): number =>
  recommendCrown(requiredKn, ratedKn, shear).mm;

export const computedSetting = (value: number, unit: string, why: string): SetupValue => ({
  value,
  unit,
  source: "computed",
  why,
});
export const givenSetting = (value: number, unit: string, why: string): SetupValue => ({
  value,
  unit,
  source: "given",
  why,
});

/** The crown as a setup value, with both parts and their reasons. */
export function describeCrown(
  requiredKn: number,
  ratedKn: number,
  shear: ShearProfile,
  units: LengthUnit,
  givenMm: number | null,
): { mm: number; value: SetupValue } {
  const rule = recommendCrown(requiredKn, ratedKn, shear);
  const baseline = `${fmtLength(rule.baselineMm, units)} with no load (${rule.baselineFromProfile ? "this shear's figure" : "0.002 in, a published shop setting"}: blades, seats and beam are not perfectly straight and the moving beam does not pass the fixed blade at one distance)`;
  const force = `${fmtLength(rule.forceMm, units)} for the load (${fmtLength(rule.atRatedMm, units)} at full rated force × ${fmtPct(rule.forceSharePct)} of the rating; ${rule.atRatedFromProfile ? "the full-force figure is this shear's own" : "the full-force figure is a default until this shear's profile states the machine's own"}: ram and bed bow apart under load, opening the gap at mid-length)`;
  if (givenMm !== null) {
    return {
      mm: givenMm,
      value: givenSetting(
        showLength(givenMm, units),
        units,
        `Given in the program: centre gap tighter than the ends by this much; our rule gives ${fmtLength(rule.mm, units)} = ${baseline} + ${force}.`,
      ),
    };
  }
  return {
    mm: rule.mm,
    value: computedSetting(
      showLength(rule.mm, units),
      units,
      `Centre ${fmtLength(rule.mm, units)} tighter than the ends = ${baseline} + ${force}.`,
    ),
  };
}

/**
 * Gap at the ends and at the centre. The ends take the blade gap the material
 * needs; the centre is set tighter by the crown so that under load the gap at
 * mid-length opens to about the same. Never below zero.
 */
export function describeCentreAndEnds(
  gapMm: number,
  gapGiven: boolean,
  crownMm: number,
  units: LengthUnit,
): { centreMm: number; endsMm: number; centre: SetupValue; ends: SetupValue } {
  const endsMm = gapMm;
  const centreMm = Math.max(0, gapMm - crownMm);
  const endsWhy = `${gapGiven ? "The blade gap given in the program" : "The blade gap for this material and thickness"}, set at both ends of the blade, where the beam barely deflects.`;
  const centreWhy =
    gapMm - crownMm >= 0
      ? `The ends' ${fmtLength(endsMm, units)} less the ${fmtLength(crownMm, units)} crown, so the gap at mid-length opens back to about ${fmtLength(endsMm, units)} while cutting.`
      : `The crown (${fmtLength(crownMm, units)}) is more than the gap (${fmtLength(endsMm, units)}): the centre cannot be set tighter than touching. Check the gap and crown against the machine's manual.`;
  const make = gapGiven ? givenSetting : computedSetting;
  return {
    centreMm,
    endsMm,
    centre: computedSetting(showLength(centreMm, units), units, centreWhy),
    ends: make(showLength(endsMm, units), units, endsWhy),
  };
}
