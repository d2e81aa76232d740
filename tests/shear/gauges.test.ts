import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  awgThicknessIn,
  GAUGE_RANGES,
  gaugeTable,
  gaugeThicknessIn,
  gaugeThicknessMm,
  ussgOuncesPerSqFt,
  type GaugeFamily,
} from "@/lib/shear";

/** Published charts give 4 decimals: our value must round to the chart's figure. */
const CHART_TOLERANCE_IN = 0.00005 + 1e-12;

const expectChart = (family: GaugeFamily, gauge: number, chartIn: number): void => {
  const t = gaugeThicknessIn(family, gauge);
  expect(t).not.toBeNull();
  expect(Math.abs((t as number) - chartIn)).toBeLessThanOrEqual(CHART_TOLERANCE_IN);
};

describe("US Standard Gauge (Act of 3 March 1893, 15 U.S.C. § 206)", () => {
  it("weights per square foot match the Act's ounces column", () => {
    expect(ussgOuncesPerSqFt(-6)).toBe(320); // 15 U.S.C. § 206: No. 0000000, 320 oz
    expect(ussgOuncesPerSqFt(0)).toBe(200); // 15 U.S.C. § 206: No. 0, 200 oz
    expect(ussgOuncesPerSqFt(1)).toBe(180); // 15 U.S.C. § 206: No. 1, 180 oz
    expect(ussgOuncesPerSqFt(2)).toBe(170); // 15 U.S.C. § 206: No. 2, 170 oz
    expect(ussgOuncesPerSqFt(10)).toBe(90); // 15 U.S.C. § 206: No. 10, 90 oz
    expect(ussgOuncesPerSqFt(15)).toBe(45); // 15 U.S.C. § 206: No. 15, 45 oz
    expect(ussgOuncesPerSqFt(17)).toBe(36); // 15 U.S.C. § 206: No. 17, 36 oz
    expect(ussgOuncesPerSqFt(21)).toBe(22); // 15 U.S.C. § 206: No. 21, 22 oz
    expect(ussgOuncesPerSqFt(38)).toBe(4); // 15 U.S.C. § 206: No. 38, 4 oz
  });

  it("thicknesses match the Act's decimal column exactly", () => {
    expect(gaugeThicknessIn("ussg", 0)).toBe(0.3125); // 15 U.S.C. § 206: No. 0 = 5/16 in
    expect(gaugeThicknessIn("ussg", 3)).toBe(0.25); // 15 U.S.C. § 206: No. 3 = 1/4 in
    expect(gaugeThicknessIn("ussg", 10)).toBe(0.140625); // 15 U.S.C. § 206: No. 10 = 9/64 in
    expect(gaugeThicknessIn("ussg", 15)).toBe(0.0703125); // 15 U.S.C. § 206: No. 15 = 9/128 in
    expect(gaugeThicknessIn("ussg", 19)).toBe(0.04375); // 15 U.S.C. § 206: No. 19 = 7/160 in
    expect(gaugeThicknessIn("ussg", 21)).toBe(0.034375); // 15 U.S.C. § 206: No. 21 = 11/320 in
  });

  it("matches stainless sheet gauge charts", () => {
    expectChart("ussg", 16, 0.0625); // 15 U.S.C. § 206: No. 16 = 1/16 in; eicac.co.uk chart, US Standard column
    expectChart("ussg", 20, 0.0375); // 15 U.S.C. § 206: No. 20 = 3/80 in; eicac.co.uk chart
    expectChart("ussg", 24, 0.025); // 15 U.S.C. § 206: No. 24 = 16 oz/ft² = 1/40 in
    expectChart("ussg", 11, 0.125); // eicac.co.uk sheet metal gauge chart, US Standard column
    expectChart("ussg", 13, 0.0938); // eicac.co.uk sheet metal gauge chart, US Standard column
  });
});

describe("Manufacturers' Standard Gauge for sheet steel (41.82 lb/ft² per inch)", () => {
  it("matches published sheet steel charts", () => {
    expectChart("msg", 10, 0.1345); // eicac.co.uk chart, standard steel; Electromechanical Design Handbook, 3rd ed., ch. 11 (10-gauge 0.1345 in)
    expectChart("msg", 16, 0.0598); // eicac.co.uk sheet metal gauge chart, standard steel column
    expectChart("msg", 20, 0.0359); // eicac.co.uk chart, standard steel column
    expectChart("msg", 24, 0.0239); // Steel Market Update, "Steel Buyers Basics" (MSG 24 gauge .0239")
    expectChart("msg", 3, 0.2391); // eicac.co.uk sheet metal gauge chart, standard steel column
    expectChart("msg", 4, 0.2242); // eicac.co.uk chart, standard steel
    expectChart("msg", 11, 0.1196); // eicac.co.uk chart, standard steel
    expectChart("msg", 14, 0.0747); // eicac.co.uk chart, standard steel
    expectChart("msg", 18, 0.0478); // eicac.co.uk chart; Electromechanical Design Handbook (18-gauge 0.0478 in)
    expectChart("msg", 22, 0.0299); // eicac.co.uk chart, standard steel
  });

  it("a 10 ga sheet weighs 5.625 lb/ft²", () => {
    // offroaders.com sheet metal gauge page: 41.82 × 0.1345 = 5.625 lb/ft²
    expect(41.82 * (gaugeThicknessIn("msg", 10) as number)).toBeCloseTo(5.625, 10);
  });
});

describe("galvanized sheet gauge (MSG weight + 2.5 oz/ft²)", () => {
  it("matches published galvanized charts", () => {
    expectChart("galvanized", 16, 0.0635); // SMACNA galvanized sheet thickness table (nominal; per ASTM A924/A653); eicac.co.uk chart
    expectChart("galvanized", 8, 0.1681); // SMACNA galvanized sheet thickness table, nominal
    expectChart("galvanized", 10, 0.1382); // SMACNA table; eicac.co.uk chart
    expectChart("galvanized", 20, 0.0396); // SMACNA table; eicac.co.uk chart
    expectChart("galvanized", 24, 0.0276); // SMACNA table; Steel Market Update "Steel Buyers Basics" (24 ga galvanized .0276")
    expectChart("galvanized", 30, 0.0157); // SMACNA table, nominal
  });
});

describe("American Wire Gauge (Brown & Sharpe) for aluminium sheet", () => {
  it("follows its definition at the anchors", () => {
    expect(awgThicknessIn(36)).toBe(0.005); // AWG definition: No. 36 = 0.005 in
    expect(awgThicknessIn(-3)).toBeCloseTo(0.46, 12); // AWG definition: No. 0000 = 0.46 in
  });
  it("matches aluminium gauge charts", () => {
    expectChart("awg", 10, 0.1019); // eicac.co.uk chart, non-ferrous / aluminium column
    expectChart("awg", 20, 0.032); // eicac.co.uk chart, non-ferrous / aluminium column (0.0320)
    expectChart("awg", 0, 0.3249); // eicac.co.uk chart, non-ferrous column
    expectChart("awg", 4, 0.2043); // eicac.co.uk chart, non-ferrous column
    expectChart("awg", 12, 0.0808); // eicac.co.uk chart, non-ferrous column
    expectChart("awg", 16, 0.0508); // eicac.co.uk chart, non-ferrous column
    expectChart("awg", 22, 0.0253); // eicac.co.uk chart, non-ferrous column
  });
});

describe("gauge lookup", () => {
  const families: GaugeFamily[] = ["msg", "galvanized", "ussg", "awg"];

  it("returns null outside a family or for a non-whole gauge", () => {
    expect(gaugeThicknessIn("msg", 2)).toBeNull(); // MSG charts start at No. 3
    expect(gaugeThicknessIn("galvanized", 7)).toBeNull(); // galvanized charts start at No. 8
    expect(gaugeThicknessIn("galvanized", 33)).toBeNull(); // galvanized charts end at No. 32
    expect(gaugeThicknessIn("ussg", 39)).toBeNull(); // the 1893 Act ends at No. 38
    expect(gaugeThicknessIn("awg", 10.5)).toBeNull();
    expect(gaugeThicknessIn("awg", Number.NaN)).toBeNull();
  });

  it("thickness falls as the gauge number rises, in every family", () => {
    for (const f of families) {
      const rows = gaugeTable(f);
      expect(rows.length).toBe(GAUGE_RANGES[f].max - GAUGE_RANGES[f].min + 1); // every whole gauge in the published range
      for (let i = 1; i < rows.length; i++) expect(rows[i].thicknessIn).toBeLessThan(rows[i - 1].thicknessIn); // gauge definitions: higher number, thinner
    }
  });

  it("mm is inches × 25.4", () => {
    expect(gaugeThicknessMm("msg", 10)).toBeCloseTo(0.1345 * 25.4, 3); // MSG chart × exact inch
  });

  it("never throws on any number", () => {
    fc.assert(
      fc.property(fc.constantFrom(...families), fc.double(), (f, n) => {
        const t = gaugeThicknessIn(f, n);
        return t === null || (Number.isFinite(t) && t > 0);
      }),
    );
  });
});
