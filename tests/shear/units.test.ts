import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { unit } from "mathjs";
import {
  areaFromMm2,
  fmtLength,
  inToMm,
  KN_PER_TONF,
  knToTonf,
  ksiToMpa,
  lengthFromMm,
  lengthToMm,
  MM_PER_IN,
  MPA_PER_KSI,
  mmToIn,
  mpaToKsi,
  roundTo,
  showLength,
  tonfToKn,
} from "@/lib/shear";

const relClose = (a: number, b: number, rel: number): boolean =>
  Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b));

describe("unit constants against mathjs", () => {
  it("1 in = 25.4 mm exactly", () => {
    expect(MM_PER_IN).toBe(unit(1, "inch").toNumber("mm")); // mathjs: inch defined as 25.4 mm exactly
    expect(inToMm(1)).toBe(25.4); // international inch (1959): exact
  });

  it("1 ksi = 6.894757 MPa (7 significant figures of 1000 lbf/in²)", () => {
    const reference = unit(1000, "psi").toNumber("MPa"); // mathjs psi → MPa
    expect(relClose(MPA_PER_KSI, reference, 1e-7)).toBe(true); // our constant is the reference rounded to 7 figures
    expect(ksiToMpa(1)).toBe(6.894757);
  });

  it("1 short ton-force = 2000 lbf = 8.896443 kN", () => {
    const reference = unit(2000, "lbf").toNumber("kN"); // mathjs lbf → kN
    expect(relClose(KN_PER_TONF, reference, 1e-7)).toBe(true);
    expect(tonfToKn(1)).toBe(8.896443);
  });

  it("converts plate sizes like mathjs does", () => {
    expect(inToMm(0.375)).toBeCloseTo(unit(0.375, "inch").toNumber("mm"), 12); // mathjs
    expect(mpaToKsi(400)).toBeCloseTo(unit(400, "MPa").toNumber("psi") / 1000, 5); // mathjs; 5 decimals covers our 7-figure ksi constant
    expect(knToTonf(100)).toBeCloseTo(unit(100, "kN").toNumber("lbf") / 2000, 5); // mathjs
    expect(areaFromMm2(645.16, "in")).toBeCloseTo(unit(645.16, "mm^2").toNumber("inch^2"), 12); // mathjs: 1 in² = 645.16 mm²
  });
});

describe("round trips are exact to floating-point tolerance", () => {
  const finite = fc.double({ min: -1e9, max: 1e9, noNaN: true, noDefaultInfinity: true });

  it("in → mm → in", () => {
    fc.assert(fc.property(finite, (x) => relClose(mmToIn(inToMm(x)), x, 1e-15) || Math.abs(x) < 1e-300));
  });
  it("ksi → MPa → ksi", () => {
    fc.assert(fc.property(finite, (x) => relClose(mpaToKsi(ksiToMpa(x)), x, 1e-15) || Math.abs(x) < 1e-300));
  });
  it("tonf → kN → tonf", () => {
    fc.assert(fc.property(finite, (x) => relClose(knToTonf(tonfToKn(x)), x, 1e-15) || Math.abs(x) < 1e-300));
  });
  it("caller's length unit → mm → caller's unit", () => {
    fc.assert(
      fc.property(
        finite,
        fc.constantFrom("in" as const, "mm" as const),
        (x, u) => relClose(lengthFromMm(lengthToMm(x, u), u), x, 1e-15) || Math.abs(x) < 1e-300,
      ),
    );
  });
});

describe("display rounding", () => {
  it("rounds half away from zero", () => {
    expect(roundTo(93.33333, 1)).toBe(93.3); // arithmetic
    expect(roundTo(0.00005, 4)).toBe(0.0001); // arithmetic
    expect(roundTo(-2.5, 0)).toBe(-3); // arithmetic
  });
  it("shows lengths to 0.0001 in and 0.001 mm", () => {
    expect(showLength(inToMm(0.134498), "in")).toBe(0.1345); // arithmetic
    expect(showLength(3.41630001, "mm")).toBe(3.416); // arithmetic
    expect(fmtLength(25.4, "in")).toBe("1 in");
    expect(fmtLength(inToMm(0.1345), "in")).toBe("0.1345 in");
    expect(fmtLength(0.05, "mm")).toBe("0.05 mm");
  });
});
