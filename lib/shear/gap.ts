/**
 * Blade gap (clearance between the upper and lower blade) by material family
 * and thickness.
 *
 * One fixed percentage per family cannot hold over the whole range: published
 * gap guidance gives the gap falling as a share of thickness as material gets
 * thicker. Each family has a thin and a thick anchor (thickness, % of
 * thickness), each with its source; between them the percentage is
 * interpolated on the logarithm of thickness (so equal ratios of thickness
 * move it by equal steps), and outside them it stays at the nearer anchor.
 * The result is clamped to the shear's gap range by `recommendGap`.
 */
import type { GradeFamily, ShearProfile } from "./types";

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
    thin: { thicknessMm: 1.0, pct: 7, source: "a shear-blade maker's general rule of 7 % of thickness (common practice)" },
    // About 5 % on half-inch plate: from memory of shear makers' gap charts. Checked against the same blade maker's
    // mild-steel clearance chart, which gives 0.005–0.009 in for 10 gauge (0.1345 in) and at least 0.007 in for 3/16 in.
    thick: { thicknessMm: 12.7, pct: 5, source: "from memory (shear makers' gap charts for mild-steel plate)" },
  },
  stainless: {
    // The fixed 9 % rule matches what shops run on thin-gauge stainless (common practice).
    thin: { thicknessMm: 1.0, pct: 9, source: "common practice (thin-gauge stainless)" },
    // About two-thirds of that on quarter-inch stainless plate: from memory of shear makers' gap charts.
    thick: { thicknessMm: 6.35, pct: 6, source: "from memory (shear makers' gap charts for stainless plate)" },
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
    thin: { thicknessMm: 2.0, pct: 12, source: "a plate maker's shearing guidance, 9–12 % for 65 ksi plate (upper end for sheet: ours)" },
    thick: { thicknessMm: 9.525, pct: 10, source: "a plate maker's shearing guidance, 9–12 % for 65 ksi plate, 3/8 in" },
  },
  "abrasion-resistant": {
    // The same plate maker: 16–18 % of thickness for 181 ksi (abrasion-resistant class) plate.
    thin: { thicknessMm: 3.0, pct: 18, source: "a plate maker's shearing guidance, 16–18 % for 181 ksi plate (upper end for thinner plate: ours)" },
    thick: { thicknessMm: 9.525, pct: 16, source: "a plate maker's shearing guidance, 16–18 % for 181 ksi plate, 3/8 in" },
  },
});

/** Gap as a percentage of thickness for a family at a thickness (log-thickness interpolation between the anchors). */
export function gapPctFor(thicknessMm: number, family: GradeFamily): number {
  const rule = GAP_RULES[family];
  if (!(thicknessMm > rule.thin.thicknessMm)) return rule.thin.pct;
  if (thicknessMm >= rule.thick.thicknessMm) return rule.thick.pct;
  const share = Math.log(thicknessMm / rule.thin.thicknessMm) / Math.log(rule.thick.thicknessMm / rule.thin.thicknessMm);
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
