import { describe, expect, it } from "vitest";
import {
  checkForce,
  checkGivenSetup,
  checkGroups,
  checkHardness,
  checkThickness,
  findGrade,
  FINDING_CATALOGUE,
  finding,
  inToMm,
  NOTHING_GIVEN,
  simulateFlow,
  validationOf,
  type FindingCode,
  type FlowCut,
  type GradeProfile,
  NARROW_STRIP_WIDTH_PER_THICKNESS,
  STRIP_DISTORTION_WIDTH_PER_THICKNESS_DEGREE,
} from "@/lib/shear";
import { DEMO_SHEAR } from "./fixtures";

const cut = (backgaugeMm: number, count: number, over: Partial<FlowCut> = {}): FlowCut => ({
  backgaugeMm,
  count,
  lengthMm: null,
  turn: false,
  scrap: false,
  ...over,
});

const REQUIRED_CODES: FindingCode[] = [
  "thickness_over_capacity",
  "force_over_rating",
  "cut_length_over_blade",
  "backgauge_out_of_travel",
  "backgauge_beyond_workpiece",
  "group_cuts_nothing",
  "gap_out_of_range",
  "rake_out_of_range",
  "hardness_over_blade_limit",
  "strip_narrow",
  "grade_unknown",
  "gauge_unknown",
  "units_inconsistent",
];

describe("finding catalogue", () => {
  it("holds every required code with a severity and a meaning", () => {
    for (const code of REQUIRED_CODES) {
      expect(FINDING_CATALOGUE[code]).toBeDefined();
      expect(FINDING_CATALOGUE[code].meaning.length).toBeGreaterThan(10); // every code documented (ours)
    }
    expect(FINDING_CATALOGUE.strip_narrow.severity).toBe("warning");
    expect(FINDING_CATALOGUE.force_over_rating.severity).toBe("error");
  });

  it("validation is fail on any error, warn on warnings only, else pass", () => {
    expect(validationOf([])).toBe("pass");
    expect(validationOf([finding("strip_narrow", "/cuts/0", "m")])).toBe("warn");
    expect(validationOf([finding("strip_narrow", "/cuts/0", "m"), finding("grade_unknown", "/grade", "m")])).toBe(
      "fail",
    );
  });
});

describe("capacity checks", () => {
  it("thickness over the grade's maximum, in the caller's units", () => {
    const [f] = checkThickness(inToMm(0.3), { mm: inToMm(0.25), source: "model" }, "A36", "/thickness/value", "in");
    expect(f).toMatchObject({
      code: "thickness_over_capacity",
      severity: "error",
      pointer: "/thickness/value",
      limit: 0.25,
      actual: 0.3,
      unit: "in",
    }); // inputs echoed in inches
    expect(checkThickness(inToMm(0.2), { mm: inToMm(0.25), source: "model" }, "A36", "/thickness/value", "in")).toEqual(
      [],
    );
  });

  it("force over rating, else dull-blade margin", () => {
    expect(checkForce(200, 100, 1.5, "/setup/rakeDeg", "mm")[0]).toMatchObject({
      code: "force_over_rating",
      limit: 100,
      actual: 200,
      unit: "kN",
    }); // inputs echoed in kN
    expect(checkForce(80, 100, 1.5, "/thickness", "mm")[0]).toMatchObject({
      code: "force_dull_blade_margin",
      severity: "warning",
      actual: 120,
    }); // 1.5 × 80 kN (dull blades, common practice)
    expect(checkForce(60, 100, 1.5, "/thickness", "mm")).toEqual([]);
  });

  it("grade harder than the blades allow", () => {
    const ar = findGrade("AR400") as GradeProfile;
    expect(checkHardness(ar, DEMO_SHEAR)[0]).toMatchObject({
      code: "hardness_over_blade_limit",
      limit: 300,
      actual: 440,
      unit: "HB",
    }); // demo blades 300 HB; AR400 class up to 440 HB
    expect(checkHardness(ar, { ...DEMO_SHEAR, maxBladeHardnessHb: null })).toEqual([]);
  });

  it("given gap and rake outside the machine's ranges", () => {
    const out = checkGivenSetup({ ...NOTHING_GIVEN, gapMm: 2, rakeDeg: 0.2 }, "/setup/bladeGapMm", DEMO_SHEAR, "mm");
    expect(out.map((f) => f.code)).toEqual(["gap_out_of_range", "rake_out_of_range"]);
    expect(out[0]).toMatchObject({ limit: 1, actual: 2, unit: "mm" }); // demo profile: gap 0.05–1 mm
    expect(out[1]).toMatchObject({ pointer: "/setup/rakeDeg", limit: 0.5, actual: 0.2, unit: "deg" }); // demo profile: rake 0.5–2.5°
  });
});

describe("group checks", () => {
  const run = (sheet: { lengthMm: number; widthMm: number }, cuts: FlowCut[], thicknessMm = 3) =>
    checkGroups({
      flow: simulateFlow(sheet, cuts),
      cuts,
      skip: cuts.map(() => false),
      shear: DEMO_SHEAR,
      thicknessMm,
      units: "mm",
    });
  const codes = (fs: ReturnType<typeof run>) => fs.map((f) => f.code);

  it("length of cut over the blade points at the sheet length", () => {
    const f = run({ lengthMm: 3500, widthMm: 1000 }, [cut(200, 2)]);
    expect(f[0]).toMatchObject({ code: "cut_length_over_blade", pointer: "/sheet/length", limit: 3100, actual: 3500 }); // demo blade 3100 mm
  });

  it("backgauge outside travel", () => {
    expect(run({ lengthMm: 2000, widthMm: 3000 }, [cut(1200, 1)])[0]).toMatchObject({
      code: "backgauge_out_of_travel",
      pointer: "/cuts/0/backgauge",
      limit: 1000,
    }); // demo travel 5–1000 mm
  });

  it("backgauge beyond the workpiece", () => {
    const f = run({ lengthMm: 2000, widthMm: 300 }, [cut(100, 4)]);
    expect(f[0]).toMatchObject({
      code: "backgauge_beyond_workpiece",
      pointer: "/cuts/0/backgauge",
      limit: 100,
      actual: 100,
    }); // 300 − 2 × 100 left at stroke 3 (our piece-flow rule)
    expect(f[0].message).toMatch(/stroke 3/);
  });

  it("group that cuts nothing", () => {
    expect(codes(run({ lengthMm: 2000, widthMm: 300 }, [cut(100, 0)]))).toContain("group_cuts_nothing");
    expect(codes(run({ lengthMm: 2000, widthMm: 300 }, [cut(100, 2), cut(50, 1)]))).toContain("group_cuts_nothing"); // remnant became a piece
    expect(codes(run({ lengthMm: 2000, widthMm: 300 }, []))).toEqual(["program_cuts_nothing"]);
  });

  it("a group of 0 strokes that names the remnant as its piece is not a fault", () => {
    // 300 mm: one 100 mm strip, then the 200 mm left is named as a 200 mm strip without a stroke (our piece-flow rule)
    const cuts = [cut(100, 1), cut(200, 0)];
    expect(run({ lengthMm: 2000, widthMm: 300 }, cuts)).toEqual([]);
    const flow = simulateFlow({ lengthMm: 2000, widthMm: 300 }, cuts);
    expect(flow.blanks.map((b) => [b.widthMm, b.count])).toEqual([
      [100, 1],
      [200, 1],
    ]);
    expect(flow.strokes).toBe(1);
    expect(codes(run({ lengthMm: 2000, widthMm: 300 }, [cut(100, 1), cut(150, 0)]))).toContain("group_cuts_nothing"); // 200 left is not 150
  });

  it("narrow strip: under 10 × thickness or 1/50 of its length (our rule)", () => {
    const byThickness = run({ lengthMm: 1000, widthMm: 500 }, [cut(25, 2)], 3); // 25 mm < 10 × 3 mm
    expect(byThickness[0]).toMatchObject({ code: "strip_narrow", severity: "warning", limit: 30, actual: 25 }); // our rule: 10 × 3 mm
    const byLength = run({ lengthMm: 3000, widthMm: 500 }, [cut(50, 2)], 1); // 50 mm < 3000 / 50 = 60 mm
    expect(byLength[0]).toMatchObject({ code: "strip_narrow", limit: 60 }); // our rule: 3000 mm / 50
    expect(run({ lengthMm: 3000, widthMm: 500 }, [cut(50, 2, { scrap: true })], 1)).toEqual([]);
  });

  it("strips likely to twist, bow and camber at this rake (our rule: 20 × thickness × rake in degrees)", () => {
    const cuts = [cut(80, 2)];
    const at = (rakeDeg: number | null, thicknessMm = 2) =>
      checkGroups({
        flow: simulateFlow({ lengthMm: 2000, widthMm: 1000 }, cuts),
        cuts,
        skip: [false],
        shear: DEMO_SHEAR,
        thicknessMm,
        rakeDeg,
        units: "mm",
      });
    const steep = at(2.5); // 80 mm < 20 × 2 mm × 2.5° = 100 mm
    expect(steep[0]).toMatchObject({
      code: "strip_distortion",
      severity: "warning",
      pointer: "/cuts/0/backgauge",
      limit: 100,
      actual: 80,
      unit: "mm",
    });
    expect(steep[0].message).toMatch(/lowest rake \(0.5°\) the strip would be clear/); // 20 × 2 × 0.5 = 20 mm < 80 mm
    expect(at(1.5)).toEqual([]); // 20 × 2 × 1.5 = 60 mm ≤ 80 mm
    expect(at(null)).toEqual([]); // no rake known: not judged
    expect(STRIP_DISTORTION_WIDTH_PER_THICKNESS_DEGREE * 0.5).toBe(NARROW_STRIP_WIDTH_PER_THICKNESS); // at 0.5° the two rules meet
    const narrow = at(2.5, 10); // 80 mm < 10 × 10 mm: already strip_narrow, no second warning
    expect(narrow.map((f) => f.code)).toEqual(["strip_narrow"]);
  });

  it("settings closer than the backgauge's repeatability (the machine's stated figure)", () => {
    const shear = { ...DEMO_SHEAR, backgaugeRepeatabilityMm: 0.05 };
    const cuts = [cut(100, 2), cut(100.03, 1), cut(100, 1), cut(150, 0)];
    const out = checkGroups({
      flow: simulateFlow({ lengthMm: 2000, widthMm: 1000 }, cuts),
      cuts,
      skip: cuts.map(() => false),
      shear,
      thicknessMm: 3,
      units: "mm",
    });
    const found = out.filter((f) => f.code === "backgauge_finer_than_repeatability");
    expect(found).toHaveLength(2); // 100.03 against 100, then 100 against 100.03; equal settings are not a difference
    expect(found[0]).toMatchObject({ severity: "warning", pointer: "/cuts/1/backgauge", limit: 0.05, unit: "mm" }); // the profile's ±0.05 mm
    expect(found[0].actual).toBeCloseTo(0.03, 9); // hand arithmetic: 100.03 − 100
    const unstated = checkGroups({
      flow: simulateFlow({ lengthMm: 2000, widthMm: 1000 }, cuts),
      cuts,
      skip: cuts.map(() => false),
      shear: DEMO_SHEAR,
      thicknessMm: 3,
      units: "mm",
    });
    expect(unstated.map((f) => f.code)).not.toContain("backgauge_finer_than_repeatability"); // no stated repeatability: not checked
  });

  it("partial strokes and a length of cut longer than the workpiece", () => {
    expect(codes(run({ lengthMm: 2000, widthMm: 500 }, [cut(100, 1, { lengthMm: 500 })]))).toEqual(["partial_stroke"]);
    expect(codes(run({ lengthMm: 2000, widthMm: 500 }, [cut(100, 1, { lengthMm: 2500 })]))).toEqual([
      "cut_length_over_workpiece",
    ]);
  });
});
