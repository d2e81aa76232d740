import { describe, expect, it } from "vitest";
import { unit } from "mathjs";
import {
  BACKGAUGE_RETRACT_MM,
  DEFAULT_CROWN_AT_RATED_MM,
  DEFAULT_CROWN_BASELINE_MM,
  DULL_BLADE_FACTOR,
  findGrade,
  gradeTensile,
  HOLD_DOWN_FULL_AT_YIELD_MPA,
  inToMm,
  NOTHING_GIVEN,
  rakedForceKn,
  ratedForceKn,
  RAKE_STEP_DEG,
  recommendCrownMm,
  recommendGap,
  recommendHoldDown,
  recommendRake,
  resolveSetup,
  type GradeProfile,
  type SetupInputs,
} from "@/lib/shear";
import { DEMO_SHEAR } from "./fixtures";

const grade = (code: string): GradeProfile => findGrade(code) as GradeProfile;
const RATED = ratedForceKn(DEMO_SHEAR);

describe("blade gap", () => {
  it("takes the family's share of thickness at this thickness (gap rules in tests/shear/gap.test.ts)", () => {
    const gap = recommendGap(4, "carbon-steel", DEMO_SHEAR);
    expect(gap.clamped).toBeNull();
    expect(gap.pct).toBeCloseTo(7 - 2 * (Math.log(4) / Math.log(12.7)), 9); // log-thickness interpolation, 7 % at 1 mm to 5 % at 12.7 mm
    expect(gap.mm).toBeCloseTo((gap.pct / 100) * 4, 12);
  });

  it("clamps to the machine's gap range and says so", () => {
    expect(recommendGap(0.5, "aluminium", DEMO_SHEAR).clamped).toBe("min"); // 5 % × 0.5 mm = 0.025 mm < 0.05 mm
    expect(recommendGap(0.5, "aluminium", DEMO_SHEAR).mm).toBe(0.05);
    expect(recommendGap(20, "abrasion-resistant", DEMO_SHEAR).clamped).toBe("max"); // 16 % × 20 mm = 3.2 mm > 1 mm
  });
});

describe("rake", () => {
  const steel = (t: number) => recommendRake(400, t, RATED, DEMO_SHEAR);

  it("is the lowest rake in range, in 0.1° steps, at which dull blades fit", () => {
    const t = inToMm(0.1875); // 3/16 in A36
    const r = steel(t);
    expect(r.basis).toBe("dull");
    expect(DULL_BLADE_FACTOR * rakedForceKn(400, t, r.deg)).toBeLessThanOrEqual(RATED);
    expect(DULL_BLADE_FACTOR * rakedForceKn(400, t, r.deg - RAKE_STEP_DEG)).toBeGreaterThan(RATED);
    expect(Math.round(r.deg / RAKE_STEP_DEG) * RAKE_STEP_DEG).toBeCloseTo(r.deg, 9);
  });

  it("takes the machine's lowest rake on thin sheet", () => {
    expect(steel(1).deg).toBe(DEMO_SHEAR.rakeMinDeg);
  });

  it("falls back to sharp blades, then to the largest rake", () => {
    expect(steel(inToMm(0.3)).basis).toBe("sharp"); // 0.3 in: dull blades would need about 3.1°, over the 2.5° maximum
    const over = steel(inToMm(0.5));
    expect(over).toEqual({ deg: DEMO_SHEAR.rakeMaxDeg, basis: "over" });
  });
});

describe("hold-down (our rule: proportional to yield)", () => {
  it("scales with yield, full force at 345 MPa, between 25 and 100 %", () => {
    expect(HOLD_DOWN_FULL_AT_YIELD_MPA).toBe(345);
    expect(recommendHoldDown(grade("A36"), 400).pct).toBe(72); // 250 / 345 = 72 %
    expect(recommendHoldDown(grade("A572-50"), 450).pct).toBe(100); // 345 / 345
    expect(recommendHoldDown(grade("5052-H32"), 215).pct).toBe(46); // 160 / 345 = 46 %
  });
  it("takes half the tensile when no yield is stated", () => {
    const cu = grade("C11000-H02");
    const r = recommendHoldDown(cu, gradeTensile(cu)?.mpa ?? null);
    expect(r.yieldFrom).toBe("tensile");
    expect(r.pct).toBe(37); // 0.5 × 255.1 MPa / 345 = 37 %
  });
});

describe("crown and retract", () => {
  it("crown = a baseline with no load + a part proportional to force (common practice)", () => {
    expect(DEFAULT_CROWN_BASELINE_MM).toBe(unit(0.002, "inch").toNumber("mm")); // US Navy shipfitter manual (NAVEDTRA 14119): centre 0.002 in less than the ends
    expect(recommendCrownMm(0, RATED, DEMO_SHEAR)).toBeCloseTo(DEFAULT_CROWN_BASELINE_MM, 12); // thin sheet: the baseline, not zero
    expect(recommendCrownMm(RATED / 2, RATED, DEMO_SHEAR)).toBeCloseTo(
      DEFAULT_CROWN_BASELINE_MM + DEFAULT_CROWN_AT_RATED_MM / 2,
      12,
    );
    expect(recommendCrownMm(RATED, RATED, { ...DEMO_SHEAR, crownAtRatedMm: 0.3, crownBaselineMm: 0.025 })).toBeCloseTo(
      0.325,
      12,
    ); // profile figures win
  });
  it("the published fixed differences are a few thousandths of an inch", () => {
    const baselineIn = unit(DEFAULT_CROWN_BASELINE_MM, "mm").toNumber("inch");
    expect(baselineIn).toBeGreaterThanOrEqual(0.001); // a mechanical squaring shear maker's manual: centre 0.001 in less than the ends
    expect(baselineIn).toBeLessThanOrEqual(0.002); // US Navy shipfitter manual: 0.010 in at the ends, 0.008 in at the centre
  });
  it("backgauge backs off about 0.1 in (common practice)", () => {
    expect(BACKGAUGE_RETRACT_MM).toBe(unit(0.1, "inch").toNumber("mm")); // mathjs
  });
});

describe("resolveSetup", () => {
  const inputs = (over: Partial<SetupInputs> = {}): SetupInputs => ({
    grade: grade("A36"),
    tensileMpa: 400,
    thicknessMm: inToMm(0.1345),
    shear: DEMO_SHEAR,
    ratedKn: RATED,
    units: "in",
    given: NOTHING_GIVEN,
    requiredKnAt: (r) => rakedForceKn(400, inToMm(0.1345), r),
    ...over,
  });

  it("computes every value and explains it in the caller's units", () => {
    const s = resolveSetup(inputs());
    for (const v of Object.values(s.report)) {
      expect(v.source).toBe("computed");
      expect(v.why.length).toBeGreaterThan(20);
    }
    expect(s.report.bladeGap.unit).toBe("in");
    expect(s.report.bladeGap.value).toBeGreaterThanOrEqual(0.005); // a shear-blade maker's mild-steel chart: 10 ga, 0.005–0.009 in
    expect(s.report.bladeGap.value).toBeLessThanOrEqual(0.009);
    expect(s.report.bladeGap.why).toContain("6 % of the 0.1345 in thickness"); // 6.0 % at 10 ga on the 7 % → 5 % rule
    expect(s.report.bladeGap.why).toMatch(/7 % at 0.0394 in and thinner, 5 % at 0.5 in and thicker/); // the carbon-steel anchors, in inches
    expect(s.report.backgaugeRetract.value).toBe(0.1); // common practice
    expect(s.report.rake.why).toMatch(/less twist, bow and camber/); // lower rake reduces distortion of narrow strips (common practice)
  });

  it("reports the gap at the ends and at the centre, the centre tighter by the crown", () => {
    const s = resolveSetup(inputs());
    expect(s.report.gapEnds.value).toBe(s.report.bladeGap.value);
    expect(s.report.gapCentre.value).toBeCloseTo(s.report.gapEnds.value - s.report.crown.value, 4);
    expect(s.report.crown.value).toBeGreaterThanOrEqual(0.002); // never near zero on sheet: the 0.002 in baseline (US Navy shipfitter manual)
    expect(s.report.crown.why).toMatch(/no load/);
    expect(s.report.crown.why).toMatch(/under load/);
    expect(s.report.gapCentre.why).toMatch(/crown/);
    expect(s.report.gapEnds.why).toMatch(/ends/);
  });

  it("never sets the centre below touching", () => {
    const s = resolveSetup(inputs({ given: { ...NOTHING_GIVEN, gapMm: 0.01, crownMm: 0.05 } }));
    expect(s.gapCentreMm).toBe(0);
    expect(s.report.gapCentre.why).toMatch(/more than the gap/);
    expect(s.report.gapEnds.source).toBe("given");
  });

  it("a given value wins, is marked given, and our rule is still shown", () => {
    const s = resolveSetup(inputs({ given: { ...NOTHING_GIVEN, gapMm: 0.5, rakeDeg: 2 } }));
    expect(s.gapMm).toBe(0.5);
    expect(s.report.bladeGap.source).toBe("given");
    expect(s.report.bladeGap.why).toMatch(/our rule/);
    expect(s.rakeDeg).toBe(2);
    expect(s.report.rake.source).toBe("given");
  });

  it("says when a clamp applies", () => {
    const s = resolveSetup(inputs({ thicknessMm: 0.5, requiredKnAt: (r) => rakedForceKn(400, 0.5, r) }));
    expect(s.report.bladeGap.why).toMatch(/smallest gap/);
  });
});
