import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import fc from "fast-check";
import { unit } from "mathjs";
import {
  checkProgram,
  findGrade,
  FINDING_CATALOGUE,
  GRADE_LIBRARY,
  programLayout,
  recommendSetup,
  remnantToleranceMm,
  type CheckResult,
  type CutProgram,
  type FindingCode,
  type GradeProfile,
} from "@/lib/shear";
import { clone, DEMO_SHEAR, WORKED_EXAMPLE } from "./fixtures";

const grade = (code: string): GradeProfile => findGrade(code) as GradeProfile;
const check = (p: unknown, g: GradeProfile | null = grade("A36"), shear: unknown = DEMO_SHEAR): CheckResult =>
  checkProgram(p, { shear: shear as typeof DEMO_SHEAR, grade: g });
const codes = (r: CheckResult): FindingCode[] => r.findings.map((f) => f.code);
const edit = (f: (p: CutProgram) => void): CutProgram => {
  const p = clone(WORKED_EXAMPLE);
  f(p);
  return p;
};

describe("the cut-program worked example in our API docs", () => {
  const r = check(WORKED_EXAMPLE);

  it("passes on the demo shear", () => {
    expect(r.findings).toEqual([]);
    expect(r.validation).toBe("pass");
  });

  it("gives exactly 56 blanks, 62 strokes and 93.3 % utilisation for 2 sheets", () => {
    expect(r.yield?.total.blanks).toBe(56); // worked example
    expect(r.yield?.total.strokes).toBe(62); // worked example
    expect(r.yield?.utilisationPct).toBe(93.3); // worked example
    expect(r.estimate?.strokes).toBe(62); // worked example
  });

  it("resolves 10 ga A36 through the Manufacturers' Standard Gauge", () => {
    expect(r.thickness).toEqual({ value: 0.1345, unit: "in", source: "gauge", gauge: 10, gaugeFamily: "msg" }); // MSG chart: 10 ga = 0.1345 in
  });

  it("reports force in short tons-force and strength in ksi for an inch program", () => {
    expect(r.force?.unit).toBe("tonf");
    expect(r.force?.tensile).toEqual({ value: 58, unit: "ksi", basis: "minimum" }); // ASTM A36: 58 ksi minimum
    expect(r.force?.dullBlade.factor).toBe(1.5); // dull blades: up to half again the force (common practice)
    expect(r.force?.maxThicknessForGrade.source).toBe("model");
    expect(r.setup?.rake).toMatchObject({ value: 1.5, unit: "deg", source: "given" }); // worked example gives 1.5°
    expect(r.setup?.bladeGap).toMatchObject({ unit: "in", source: "computed" });
  });

  it("places the sheet apart from the check", () => {
    expect(r).not.toHaveProperty("layout");
    const layout = programLayout(WORKED_EXAMPLE, remnantToleranceMm(DEMO_SHEAR));
    expect(layout?.rectangles.filter((rect) => rect.kind === "blank")).toHaveLength(28); // worked example: 28 blanks per sheet
    expect(layout?.cuts).toHaveLength(31); // worked example: 3 rips + 4 × 7 crosscuts per sheet
  });

  it("does not change the program", () => {
    const p = clone(WORKED_EXAMPLE);
    check(p);
    expect(p).toEqual(WORKED_EXAMPLE);
  });
});

describe("millimetre programs get millimetres, MPa and kN back", () => {
  const p: CutProgram = {
    grade: "304",
    thickness: { value: 2 },
    units: "mm",
    sheet: { length: 3000, width: 1500, count: 1 },
    cuts: [{ backgauge: 500, count: 2 }],
  };
  const r = check(p, grade("304"));

  it("uses the caller's units", () => {
    expect(r.force?.unit).toBe("kN");
    expect(r.force?.tensile).toEqual({ value: 515, unit: "MPa", basis: "minimum" }); // ASTM A240: 515 MPa
    expect(r.setup?.bladeGap.unit).toBe("mm");
    expect(r.setup?.bladeGap.value).toBe(0.1); // 5 % × 2 mm: stainless at 16 gauge and heavier (SSINA fabrication guidance)
    expect(r.yield?.areaUnit).toBe("mm2");
    expect(r.yield?.total.blanks).toBe(3); // 2 cut + the 500 mm remnant equal to the backgauge (our piece-flow rule)
  });

  it("inch and millimetre versions of a program agree", () => {
    const inch = check(edit((q) => (q.setup = undefined)));
    const mm = check(
      edit((q) => {
        q.units = "mm";
        q.sheet = { length: 120 * 25.4, width: 48 * 25.4, count: 2 };
        q.cuts = [
          { backgauge: 12 * 25.4, count: 3 },
          { turn: true, backgauge: 16 * 25.4, length: 12 * 25.4, count: 7 },
        ];
        q.setup = undefined;
      }),
    );
    expect(mm.yield?.total.blanks).toBe(inch.yield?.total.blanks); // same program in mm: same 56 blanks
    expect(mm.setup?.rake.value).toBe(inch.setup?.rake.value); // same program in mm: same rake
    expect(mm.force?.required).toBeCloseTo(unit((inch.force?.required ?? 0) * 2000, "lbf").toNumber("kN"), 0); // tonf → kN via mathjs: 1 tonf = 2000 lbf
  });
});

describe("findings from checkProgram", () => {
  it("unknown grade and an unresolvable gauge", () => {
    const r = check(WORKED_EXAMPLE, null);
    expect(codes(r)).toEqual(["grade_unknown", "gauge_unknown"]);
    expect(r.findings[0].pointer).toBe("/grade");
    expect(r.findings[1].pointer).toBe("/thickness/gauge");
    expect(r.validation).toBe("fail");
    expect(r.force).toBeNull();
    expect(r.yield?.total.blanks).toBe(56); // the flow needs no grade
  });

  it("catalogue entry for another grade", () => {
    expect(codes(check(WORKED_EXAMPLE, grade("304")))).toContain("grade_unknown");
  });

  it("gauge outside the family or a grade with no gauge system", () => {
    expect(codes(check(edit((p) => (p.thickness = { gauge: 99 }))))).toEqual(["gauge_unknown"]);
    expect(
      codes(
        check(
          edit((p) => (p.grade = "C11000-H02")),
          grade("C11000-H02"),
        ),
      ),
    ).toEqual(["gauge_unknown"]);
  });

  it("grade with no tensile strength", () => {
    const g = { ...grade("A36"), tensileMinMpa: null };
    expect(codes(check(WORKED_EXAMPLE, g))).toEqual(["grade_incomplete"]);
  });

  it("unknown or missing shear", () => {
    const r = check(WORKED_EXAMPLE, grade("A36"), null);
    expect(codes(r)).toEqual(["shear_unknown"]);
    expect(r.estimate).toBeNull();
    expect(codes(check(WORKED_EXAMPLE, grade("A36"), { ...DEMO_SHEAR, bladeLengthMm: Number.NaN }))).toEqual([
      "shear_unknown",
    ]);
  });

  it("units: missing, disagreeing, or looking like the other unit", () => {
    expect(codes(check(edit((p) => ((p as { units: string }).units = "cm"))))).toEqual(["units_inconsistent"]);
    const twoGaps = check(edit((p) => (p.setup = { bladeGapMm: 0.25, bladeGapIn: 0.02 })));
    expect(twoGaps.findings.find((f) => f.code === "units_inconsistent")?.pointer).toBe("/setup/bladeGapIn");
    const agreeing = check(edit((p) => (p.setup = { bladeGapMm: 0.254, bladeGapIn: 0.01 })));
    expect(codes(agreeing)).not.toContain("units_inconsistent");
    const mmAsInches = check(edit((p) => (p.sheet = { length: 3000, width: 1200, count: 1 })));
    expect(codes(mmAsInches)).toContain("units_suspect");
    expect(codes(mmAsInches)).toContain("cut_length_over_blade");
    const justTooLong = check(edit((p) => (p.sheet = { length: 130, width: 48, count: 1 }))); // a real 130 in sheet: too long, not mm
    expect(codes(justTooLong)).toEqual(["cut_length_over_blade"]);
  });

  it("thickness over capacity and force over rating", () => {
    const r = check(edit((p) => (p.thickness = { value: 0.3 })));
    expect(codes(r)).toEqual(expect.arrayContaining(["thickness_over_capacity", "force_over_rating"]));
    const t = r.findings.find((f) => f.code === "thickness_over_capacity");
    expect(t).toMatchObject({ pointer: "/thickness/value", unit: "in", actual: 0.3 });
    expect(t?.limit).toBeCloseTo(0.25 * Math.sqrt(60 / (400 / 6.894757)), 4); // t_rated · √(60 ksi / A36 58.0 ksi)
  });

  it("recommends a higher rake rather than exceeding the rating when it can", () => {
    const r = check(edit((p) => ((p.thickness = { value: 0.25 }), (p.setup = undefined))));
    expect(codes(r)).not.toContain("force_over_rating");
    expect(r.setup?.rake.source).toBe("computed");
    expect(r.setup?.rake.value).toBeGreaterThan(1.5); // above the demo rated rake, so dull blades fit
  });

  it("dull-blade margin at a given low rake", () => {
    const r = check(edit((p) => (p.thickness = { value: 0.25 })));
    expect(codes(r)).toEqual(["force_dull_blade_margin"]);
    expect(r.findings[0].pointer).toBe("/setup/rakeDeg");
    expect(r.validation).toBe("warn");
  });

  it("grade harder than the blades allow", () => {
    const r = check(
      edit((p) => ((p.grade = "AR400"), (p.thickness = { value: 0.1 }))),
      grade("AR400"),
    );
    expect(codes(r)).toContain("hardness_over_blade_limit");
  });

  it("given gap and rake outside range", () => {
    const r = check(edit((p) => (p.setup = { rakeDeg: 5, bladeGapIn: 0.1 })));
    expect(codes(r)).toEqual(expect.arrayContaining(["rake_out_of_range", "gap_out_of_range"]));
    expect(r.setup?.bladeGap.source).toBe("given");
    expect(r.setup?.bladeGap.why).toMatch(/OUTSIDE/);
  });

  it("group problems point into the group", () => {
    const r = check(
      edit((p) => {
        p.cuts = [
          { backgauge: 12, count: 5 },
          { backgauge: 1, count: 0 },
        ];
      }),
    );
    expect(r.findings.map((f) => [f.code, f.pointer])).toEqual([
      ["backgauge_beyond_workpiece", "/cuts/0/backgauge"],
      ["group_cuts_nothing", "/cuts/1/count"],
    ]);
  });

  it("invalid values are findings, never exceptions", () => {
    const r = check(edit((p) => ((p.sheet.width = -4), (p.cuts[0].count = 1.5))));
    expect(r.findings.filter((f) => f.code === "value_invalid").map((f) => f.pointer)).toEqual([
      "/sheet/width",
      "/cuts/0/count",
    ]);
    expect(r.yield).toBeNull();
    expect(check(null).findings[0]).toMatchObject({ code: "value_invalid", pointer: "" });
  });

  it("from: only with turn, only an earlier group, and each group's pieces turned once", () => {
    const ptrs = (r: CheckResult) => r.findings.filter((f) => f.code === "value_invalid").map((f) => f.pointer);
    expect(
      ptrs(
        check(
          edit(
            (p) =>
              (p.cuts = [
                { backgauge: 12, count: 3 },
                { backgauge: 16, count: 7, from: 0 },
              ]),
          ),
        ),
      ),
    ).toEqual(["/cuts/1/from"]);
    expect(
      ptrs(
        check(
          edit(
            (p) =>
              (p.cuts = [
                { backgauge: 12, count: 3 },
                { backgauge: 16, count: 7, turn: true, from: 1 },
              ]),
          ),
        ),
      ),
    ).toEqual(["/cuts/1/from"]);
    const twice = check(
      edit(
        (p) =>
          (p.cuts = [
            { backgauge: 12, count: 3 },
            { backgauge: 16, count: 7, turn: true, from: 0 },
            { backgauge: 16, count: 7, turn: true, from: 0 },
          ]),
      ),
    );
    expect(ptrs(twice)).toEqual(["/cuts/2/from"]);
    // A strip kind ripped first and crosscut after another kind: worked example sheet, 12 in and 8 in strips.
    const two = check(
      edit((p) => {
        p.cuts = [
          { backgauge: 12, count: 2 }, // two 12 in strips, 24 in left
          { backgauge: 8, count: 2 }, // three 8 in strips (the 8 in remnant is the third)
          { backgauge: 16, count: 7, turn: true, from: 0 },
          { backgauge: 20, count: 5, turn: true, from: 1 },
        ];
      }),
    );
    expect(two.findings.filter((f) => f.severity === "error")).toEqual([]);
    expect(two.yield?.perSheet.blanks).toBe(2 * 7 + 3 * 6); // hand arithmetic: 7 per 12 in strip (8 in offcut), 6 per 8 in strip (120 = 6 × 20)
  });

  it("every code in a result is in the catalogue with the catalogue's severity", () => {
    const r = check(edit((p) => (p.thickness = { value: 0.3 })));
    for (const f of r.findings) expect(f.severity).toBe(FINDING_CATALOGUE[f.code].severity);
  });
});

describe("setup recommendation for grade × thickness × shear", () => {
  it("works for every seed grade with a tensile strength", () => {
    for (const g of GRADE_LIBRARY) {
      const s = recommendSetup({ grade: g, shear: DEMO_SHEAR, thicknessMm: 2, units: "mm" });
      expect(s).not.toBeNull();
      expect(s?.setup.rake.value).toBeGreaterThanOrEqual(DEMO_SHEAR.rakeMinDeg);
      expect(s?.setup.rake.value).toBeLessThanOrEqual(DEMO_SHEAR.rakeMaxDeg);
    }
  });
});

// ---------------------------------------------------------------------------
// Properties
// ---------------------------------------------------------------------------

const num = fc.oneof(
  fc.double({ min: -10, max: 5000 }),
  fc.integer({ min: -3, max: 60 }),
  fc.constantFrom(0, Number.NaN, Number.POSITIVE_INFINITY, 1e308, 5e-324),
);
const programArb = fc.record(
  {
    grade: fc.oneof(fc.constantFrom(...GRADE_LIBRARY.map((g) => g.code)), fc.string()),
    thickness: fc.oneof(fc.record({ value: num }), fc.record({ gauge: num }), fc.anything()),
    units: fc.oneof(fc.constantFrom("in", "mm"), fc.anything()),
    sheet: fc.oneof(
      fc.record({ length: num, width: num, count: fc.oneof(fc.integer({ min: -1, max: 5 }), num) }),
      fc.anything(),
    ),
    cuts: fc.oneof(
      fc.array(
        fc.record(
          {
            backgauge: num,
            count: fc.oneof(fc.integer({ min: -1, max: 20 }), num),
            length: num,
            turn: fc.oneof(fc.boolean(), fc.anything()),
            scrap: fc.boolean(),
          },
          { requiredKeys: ["backgauge", "count"] },
        ),
        { maxLength: 8 },
      ),
      fc.anything(),
    ),
    setup: fc.oneof(
      fc.record(
        { rakeDeg: num, bladeGapMm: num, bladeGapIn: num, holdDownPct: num, crownIn: num, backgaugeRetractMm: num },
        { requiredKeys: [] },
      ),
      fc.anything(),
    ),
  },
  { requiredKeys: [] },
);
const contextGrade = (p: unknown): GradeProfile | null =>
  typeof (p as { grade?: unknown })?.grade === "string" ? findGrade((p as { grade: string }).grade) : null;

describe("properties of checkProgram", () => {
  it("no generated program throws", () => {
    fc.assert(
      fc.property(programArb, (p) => {
        check(p, contextGrade(p));
      }),
      { numRuns: 1000 },
    );
  });

  it("no input at all throws, whatever the context", () => {
    fc.assert(
      fc.property(fc.anything(), fc.anything(), (p, ctx) => {
        checkProgram(p, ctx as never);
        checkProgram(p, { shear: DEMO_SHEAR, grade: grade("A36") });
      }),
    );
  });

  it("the same input always gives the same output", () => {
    fc.assert(
      fc.property(
        programArb,
        (p) => JSON.stringify(check(p, contextGrade(p))) === JSON.stringify(check(p, contextGrade(p))),
      ),
      { numRuns: 300 },
    );
  });

  it("every pointer lands in the program (or on a field it could carry)", () => {
    const resolves = (doc: unknown, pointer: string): boolean => {
      if (pointer === "") return true;
      const parts = pointer.slice(1).split("/");
      let cur: unknown = doc;
      for (let i = 0; i < parts.length - 1; i++) {
        if (typeof cur !== "object" || cur === null) return false;
        cur = (cur as Record<string, unknown>)[parts[i]];
      }
      return typeof cur === "object" && cur !== null;
    };
    fc.assert(
      fc.property(programArb, (p) => check(p, contextGrade(p)).findings.every((f) => resolves(p, f.pointer))),
      { numRuns: 300 },
    );
  });

  it("validation agrees with the findings", () => {
    fc.assert(
      fc.property(programArb, (p) => {
        const r = check(p, contextGrade(p));
        const expected = r.findings.some((f) => f.severity === "error") ? "fail" : r.findings.length ? "warn" : "pass";
        return r.validation === expected;
      }),
      { numRuns: 300 },
    );
  });
});

// ---------------------------------------------------------------------------
// The module itself
// ---------------------------------------------------------------------------

describe("the module", () => {
  const dir = join(__dirname, "../../lib/shear");
  const sources = readdirSync(dir).filter((f) => f.endsWith(".ts"));
  const importsOf = (file: string): string[] =>
    [...readFileSync(join(dir, file), "utf8").matchAll(/(?:import|export)[^"']*?from\s+["']([^"']+)["']/g)].map(
      (m) => m[1],
    );

  it("imports nothing but its own files (no framework, ORM or I/O)", () => {
    for (const f of sources)
      for (const spec of importsOf(f)) expect(spec, `${f} imports ${spec}`).toMatch(/^\.\/[a-z]+$/);
  });

  it("has no import cycles", () => {
    const graph = new Map(sources.map((f) => [f.replace(/\.ts$/, ""), importsOf(f).map((s) => s.slice(2))]));
    const state = new Map<string, "visiting" | "done">();
    const visit = (n: string, path: string[]): void => {
      if (state.get(n) === "done") return;
      expect(state.get(n), `cycle: ${[...path, n].join(" → ")}`).not.toBe("visiting");
      state.set(n, "visiting");
      for (const m of graph.get(n) ?? []) visit(m, [...path, n]);
      state.set(n, "done");
    };
    for (const n of graph.keys()) visit(n, []);
  });

  it("its README documents every finding code with its severity", () => {
    const readme = readFileSync(join(dir, "README.md"), "utf8");
    for (const [code, spec] of Object.entries(FINDING_CATALOGUE))
      expect(readme).toContain(`| \`${code}\` | ${spec.severity} | ${spec.meaning} |`);
  });
});
