import { describe, expect, it } from "vitest";
import { unit } from "mathjs";
import {
  DEFAULT_SHEAR_TENSILE_RATIO,
  findGrade,
  GRADE_LIBRARY,
  gradeShearStrengthMpa,
  gradeTensile,
  mpaToKsi,
  type GradeProfile,
} from "@/lib/shear";

const g = (code: string): GradeProfile => {
  const grade = findGrade(code);
  if (grade === null) throw new Error(`missing ${code}`);
  return grade;
};
const ksi = (mpa: number | null | undefined): number => mpaToKsi(mpa as number);

describe("seed grade library: the standards' minimums", () => {
  it("holds the seed grades, each naming its standard", () => {
    expect(GRADE_LIBRARY.map((x) => x.code)).toEqual([
      "A36",
      "A572-50",
      "304",
      "316",
      "5052-H32",
      "6061-T6",
      "C11000-H02",
      "AR400",
      "A1011-CS",
      "A1008-CS",
    ]); // the seed list (ours)
    for (const grade of GRADE_LIBRARY) expect(grade.standard.length).toBeGreaterThan(3);
  });

  it("A36", () => {
    expect(g("A36").standard).toMatch(/ASTM A36/);
    expect(g("A36").yieldMpa).toBe(250); // ASTM A36/A36M: yield min 36 ksi [250 MPa]
    expect(g("A36").tensileMinMpa).toBe(400); // ASTM A36/A36M: tensile 58–80 ksi [400–550 MPa]
    expect(g("A36").tensileMaxMpa).toBe(550); // ASTM A36/A36M
    expect(ksi(g("A36").tensileMinMpa)).toBeCloseTo(58, 0); // ASTM A36 inch-pound value, 58 ksi
  });

  it("A572 Grade 50", () => {
    expect(g("A572-50").yieldMpa).toBe(345); // ASTM A572/A572M Gr 50: 50 ksi [345 MPa]
    expect(g("A572-50").tensileMinMpa).toBe(450); // ASTM A572/A572M Gr 50: 65 ksi [450 MPa]
  });

  it("304 and 316 stainless", () => {
    for (const code of ["304", "316"]) {
      expect(g(code).standard).toMatch(/ASTM A240/);
      expect(g(code).yieldMpa).toBe(205); // ASTM A240/A240M: 30 ksi [205 MPa]
      expect(g(code).tensileMinMpa).toBe(515); // ASTM A240/A240M: 75 ksi [515 MPa]
      expect(g(code).gaugeFamily).toBe("ussg"); // stainless sheet is sold by the US Standard Gauge (common practice)
    }
    expect(g("304").hardnessHb).toBe(201); // ASTM A240 Type 304 max 201 HB (from memory; the same figure appears in ASTM A213 for 304 tube)
    expect(g("316").hardnessHb).toBe(217); // ASTM A240 Type 316 max 217 HB (from memory)
  });

  it("aluminium 5052-H32 and 6061-T6 sheet", () => {
    expect(g("5052-H32").yieldMpa).toBe(160); // ASTM B209: 23 ksi [160 MPa]
    expect(g("5052-H32").tensileMinMpa).toBe(215); // ASTM B209: 31–38 ksi [215–265 MPa]
    expect(g("5052-H32").tensileMaxMpa).toBe(265); // ASTM B209
    expect(g("6061-T6").yieldMpa).toBe(240); // ASTM B209: 35 ksi [240 MPa]
    expect(g("6061-T6").tensileMinMpa).toBe(290); // ASTM B209: 42 ksi [290 MPa]
    expect(g("6061-T6").gaugeFamily).toBe("awg"); // aluminium sheet by Brown & Sharpe gauge (common practice)
  });

  it("C11000 H02 copper", () => {
    expect(g("C11000-H02").standard).toMatch(/ASTM B152/);
    expect(g("C11000-H02").tensileMinMpa).toBeCloseTo(unit(37000, "psi").toNumber("MPa"), 3); // ASTM B152: 37–46 ksi; mathjs psi → MPa
    expect(g("C11000-H02").tensileMaxMpa).toBeCloseTo(unit(46000, "psi").toNumber("MPa"), 3); // ASTM B152; mathjs
    expect(g("C11000-H02").yieldMpa).toBeNull();
  });

  it("AR400 and commercial steel carry typical values, marked as typical", () => {
    expect(g("AR400").valuesAreTypical).toBe(true);
    expect(g("AR400").standard).toMatch(/no ASTM/);
    expect(ksi(g("AR400").tensileTypicalMpa)).toBeCloseTo(180, 6); // about 180 ksi typical (AR400 plate suppliers; from memory)
    expect(g("AR400").hardnessHb).toBe(440); // 360–440 HB class, upper end (AR400 is sold by hardness)
    for (const code of ["A1011-CS", "A1008-CS"]) {
      expect(g(code).valuesAreTypical).toBe(true); // ASTM A1011 / A1008 CS: no mandatory strength
      expect(g(code).tensileMinMpa).toBeNull();
      expect(gradeTensile(g(code))?.basis).toBe("typical");
    }
  });
});

describe("strength a check uses", () => {
  it("is the minimum tensile when there is one, else the typical", () => {
    expect(gradeTensile(g("A36"))).toEqual({ mpa: 400, basis: "minimum" }); // ASTM A36/A36M: 400 MPa minimum
    expect(gradeTensile(g("AR400"))?.basis).toBe("typical");
    expect(gradeTensile({ ...g("A36"), tensileMinMpa: null, tensileTypicalMpa: null })).toBeNull();
  });

  it("shear strength is tensile × ratio, steels 0.75 by default", () => {
    expect(DEFAULT_SHEAR_TENSILE_RATIO["carbon-steel"]).toBe(0.75); // steels about 0.6–0.8 of tensile (common practice); midpoint-ish default
    expect(gradeShearStrengthMpa(g("A36"))).toBeCloseTo(300, 9); // 400 MPa × 0.75
    expect(gradeShearStrengthMpa(g("5052-H32"))).toBeCloseTo(129, 9); // 215 MPa × 0.6 (aluminium ratio, from memory)
  });

  it("finds grades case-insensitively", () => {
    expect(findGrade(" a36 ")?.code).toBe("A36");
    expect(findGrade("nope")).toBeNull();
  });
});
