/**
 * Blade gap by family and thickness against published gap guidance. Each
 * check names its source; anchors without a published figure are marked
 * `common practice` or `from memory` in lib/shear/gap.ts and here.
 */
import { describe, expect, it } from "vitest";
import { unit } from "mathjs";
import { GAP_RULES, gapPctFor, gaugeThicknessIn, recommendGap, type GradeFamily, type ShearProfile } from "@/lib/shear";
import { DEMO_SHEAR } from "./fixtures";

/** A shear whose gap range never clamps, so the rule itself is seen. */
const WIDE: ShearProfile = { ...DEMO_SHEAR, gapMinMm: 0, gapMaxMm: 50 };
const gapIn = (thicknessIn: number, family: GradeFamily): number => unit(recommendGap(unit(thicknessIn, "inch").toNumber("mm"), family, WIDE).mm, "mm").toNumber("inch"); // conversions via mathjs
const FAMILIES = Object.keys(GAP_RULES) as GradeFamily[];

describe("published mild-steel clearances", () => {
  it("10 gauge (MSG 0.1345 in) falls within 0.005–0.009 in", () => {
    const tenGauge = gaugeThicknessIn("msg", 10) as number; // 0.1345 in (Manufacturers' Standard Gauge)
    const gap = gapIn(tenGauge, "carbon-steel");
    expect(gap).toBeGreaterThanOrEqual(0.005); // a shear-blade maker's published clearance chart for mild steel: 10 ga, 0.005–0.009 in
    expect(gap).toBeLessThanOrEqual(0.009);
  });

  it("3/16 in plate gets at least the chart's 0.007 in", () => {
    expect(gapIn(0.1875, "carbon-steel")).toBeGreaterThanOrEqual(0.007); // the same chart: 3/16 in from 0.007 in
  });

  it("thin sheet takes the 7 % general rule, half-inch plate about 5 %", () => {
    expect(gapPctFor(1, "carbon-steel")).toBe(7); // a shear-blade maker's general rule: 7 % of thickness (common practice)
    expect(gapPctFor(12.7, "carbon-steel")).toBe(5); // from memory: shear makers' gap charts for 1/2 in mild steel
  });
});

describe("published high-strength plate clearances", () => {
  it("65 ksi plate (3/8 in) within 9–12 % of thickness", () => {
    const pct = gapPctFor(9.525, "hsla-steel");
    expect(pct).toBeGreaterThanOrEqual(9); // a plate maker's shearing guidance: A572-65 class, 9–12 % of t
    expect(pct).toBeLessThanOrEqual(12);
    expect(gapPctFor(2, "hsla-steel")).toBeLessThanOrEqual(12); // thin end stays inside the published band
  });

  it("181 ksi plate (3/8 in) within 16–18 % of thickness", () => {
    const pct = gapPctFor(9.525, "abrasion-resistant");
    expect(pct).toBeGreaterThanOrEqual(16); // a plate maker's shearing guidance: 181 ksi plate, 16–18 % of t
    expect(pct).toBeLessThanOrEqual(18);
    expect(gapPctFor(3, "abrasion-resistant")).toBeLessThanOrEqual(18); // thin end stays inside the published band
  });
});

describe("stainless: thin gauge as shops run it, plate tighter", () => {
  it("thin gauge at 9 %, quarter-inch plate at 6 %", () => {
    expect(gapPctFor(1, "stainless")).toBe(9); // common practice: the 9 % rule matches thin-gauge stainless
    expect(gapPctFor(6.35, "stainless")).toBe(6); // from memory: shear makers' gap charts for 1/4 in stainless
    // The fixed 9 % rule was half again as wide as this on plate.
    expect(9 / gapPctFor(6.35, "stainless")).toBeCloseTo(1.5, 9);
  });

  it("20 gauge stainless (USSG 0.0375 in) gets about 0.0034 in", () => {
    const gauge20 = gaugeThicknessIn("ussg", 20) as number; // 0.0375 in (15 U.S.C. § 206)
    expect(gapIn(gauge20, "stainless")).toBeCloseTo(0.0375 * 0.09, 5); // below the 1 mm anchor: 9 % (common practice)
  });
});

describe("the shape of the rule", () => {
  it("the share of thickness never rises with thickness, and the gap itself never falls", () => {
    for (const family of FAMILIES) {
      let lastPct = Number.POSITIVE_INFINITY;
      let lastGap = 0;
      for (let t = 0.3; t <= 30; t *= 1.1) {
        const pct = gapPctFor(t, family);
        const gap = recommendGap(t, family, WIDE).mm;
        expect(pct).toBeLessThanOrEqual(lastPct + 1e-12);
        expect(gap).toBeGreaterThanOrEqual(lastGap - 1e-12);
        lastPct = pct;
        lastGap = gap;
      }
    }
  });

  it("meets each anchor exactly and stays at the nearer anchor outside them", () => {
    for (const family of FAMILIES) {
      const rule = GAP_RULES[family];
      expect(gapPctFor(rule.thin.thicknessMm, family)).toBe(rule.thin.pct);
      expect(gapPctFor(rule.thick.thicknessMm, family)).toBe(rule.thick.pct);
      expect(gapPctFor(rule.thin.thicknessMm / 4, family)).toBe(rule.thin.pct);
      expect(gapPctFor(rule.thick.thicknessMm * 4, family)).toBe(rule.thick.pct);
      expect(rule.thin.source.length).toBeGreaterThan(10);
      expect(rule.thick.source.length).toBeGreaterThan(10);
    }
  });

  it("interpolates on the logarithm of thickness: the geometric mean of the anchors gets the mean share", () => {
    const rule = GAP_RULES.stainless;
    const middle = Math.sqrt(rule.thin.thicknessMm * rule.thick.thicknessMm);
    expect(gapPctFor(middle, "stainless")).toBeCloseTo((rule.thin.pct + rule.thick.pct) / 2, 9);
  });
});
