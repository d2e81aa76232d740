/**
 * Planning demand onto sheets. Property tests: every blank appears exactly as often as
 * asked (or is reported as unplaced), no two pieces overlap, every piece lies on its sheet
 * inside its strip, and strips stack inside the sheet (so every cut is a full guillotine
 * cut). Quality: sheets used on the 2D bin-packing classes (Berkey & Wang 1987, classes 1–6;
 * Martello & Vigo 1998, classes 7–10) against the area lower bound, reported per class.
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import {
  areaLowerBound,
  planBlanks,
  type Blank,
  type Plan,
  type PlanOptions,
  type Stock,
} from "../../lib/planner/plan";
import { simulateFlow } from "../../lib/shear/flow";
import { gcut, TABLE } from "./gcut";

const sizeKey = (a: number, b: number) => (a <= b ? `${a}x${b}` : `${b}x${a}`);

function checkPlan(plan: Plan, stock: Stock[], blanks: Blank[], options: PlanOptions = {}) {
  blanks.forEach((b, i) => {
    const unplaced = plan.unplaced.filter((u) => u.blank === i).reduce((s, u) => s + u.quantity, 0);
    const allowance = Math.floor((b.quantity * (options.overProductionPct ?? 0)) / 100);
    expect(plan.produced[i] - plan.extra[i] + unplaced, `blank ${i}`).toBe(b.quantity);
    expect(plan.extra[i]).toBeLessThanOrEqual(allowance);
  });
  for (const p of plan.patterns) {
    const sheet = stock[p.stock];
    expect(p.rotated ? [p.width, p.length] : [p.length, p.width]).toEqual([sheet.length, sheet.width]);
    let y = p.strips[0]?.y ?? 0;
    expect(y).toBeGreaterThanOrEqual(options.trim ?? 0);
    const rects: { x: number; y: number; l: number; w: number }[] = [];
    for (const st of p.strips) {
      expect(st.y).toBe(y); // strips follow each other across the sheet: each rip is a full cut of the sheet
      y += st.width;
      let x = st.pieces[0]?.x ?? 0;
      for (const pc of st.pieces) {
        expect(pc.x).toBe(x); // pieces follow each other along the strip: each crosscut is a full cut of the strip
        expect(pc.y).toBe(st.y);
        x += pc.length;
        expect(pc.width).toBeLessThanOrEqual(st.width); // and a narrower piece is trimmed by a full cut of that piece
        const b = blanks[pc.blank];
        expect([pc.length, pc.width]).toEqual(pc.turned !== p.rotated ? [b.width, b.length] : [b.length, b.width]); // grain follows the sheet
        if (pc.turned) expect(b.canTurn).toBe(true);
        rects.push({ x: pc.x, y: pc.y, l: pc.length, w: pc.width });
      }
      expect(x).toBeLessThanOrEqual(p.length);
    }
    expect(y).toBeLessThanOrEqual(p.width);
    // Pieces and offcuts tile the sheet: nothing overlaps, everything lies on the sheet, the areas add up.
    for (const o of p.offcuts) rects.push({ x: o.x, y: o.y, l: o.length, w: o.width });
    for (const r of rects) {
      expect(r.x >= 0 && r.y >= 0 && r.x + r.l <= p.length && r.y + r.w <= p.width).toBe(true);
    }
    for (let i = 0; i < rects.length; i++)
      for (let j = i + 1; j < rects.length; j++) {
        const a = rects[i],
          b = rects[j];
        expect(a.x < b.x + b.l && b.x < a.x + a.l && a.y < b.y + b.w && b.y < a.y + a.w, "overlap").toBe(false);
      }
    expect(rects.reduce((s, r) => s + r.l * r.w, 0)).toBe(p.length * p.width);
    // The pattern's program, run through the shear core's piece flow, makes exactly its pieces.
    const flow = simulateFlow(
      { lengthMm: p.length, widthMm: p.width },
      p.cuts.map((c) => ({
        backgaugeMm: c.backgauge,
        count: c.count,
        lengthMm: null,
        turn: !!c.turn,
        from: c.from ?? null,
        scrap: !!c.scrap,
      })),
    );
    const made = new Map<string, number>();
    for (const b of flow.blanks)
      made.set(sizeKey(b.widthMm, b.lengthMm), (made.get(sizeKey(b.widthMm, b.lengthMm)) ?? 0) + b.count);
    const want = new Map<string, number>();
    for (const st of p.strips)
      for (const pc of st.pieces)
        want.set(sizeKey(pc.length, pc.width), (want.get(sizeKey(pc.length, pc.width)) ?? 0) + 1);
    expect(made).toEqual(want);
    expect(flow.groups.every((g) => g.beyond === null)).toBe(true);
  }
  const used = new Map<number, number>();
  for (const p of plan.patterns) used.set(p.stock, (used.get(p.stock) ?? 0) + p.repeats);
  stock.forEach((s, i) => {
    if (s.count !== null) expect(used.get(i) ?? 0).toBeLessThanOrEqual(s.count);
  });
}

describe("planning blanks onto sheets", () => {
  it("plans the worked example's blanks onto two sheets with 56 blanks and one strip of trim each", async () => {
    // 56 blanks of 16 x 12 in from 120 x 48 in sheets (the cut-program worked example of our API docs)
    const plan = await planBlanks(
      [{ length: 120, width: 48, count: null }],
      [{ label: "panel", length: 16, width: 12, quantity: 56 }],
    );
    expect(plan.sheetsUsed).toBe(2);
    expect(plan.produced).toEqual([56]);
    expect(plan.utilisation).toBeCloseTo(0.9333, 4);
  });

  it("reports a blank that fits no sheet instead of dropping it", async () => {
    const plan = await planBlanks(
      [{ length: 100, width: 50, count: null }],
      [
        { label: "too long", length: 120, width: 10, quantity: 3 },
        { label: "ok", length: 10, width: 10, quantity: 2 },
      ],
    );
    expect(plan.unplaced).toEqual([
      { blank: 0, quantity: 3, kind: "unplaceable", reason: expect.stringMatching(/fits on none/) },
    ]);
    expect(plan.produced).toEqual([0, 2]);
  });

  it("keeps to the sheets on hand and says what is left", async () => {
    const plan = await planBlanks(
      [{ length: 10, width: 10, count: 1 }],
      [{ label: "a", length: 10, width: 10, quantity: 3 }],
    );
    expect(plan.sheetsUsed).toBe(1);
    expect(plan.unplaced).toEqual([{ blank: 0, quantity: 2, kind: "stock_short", reason: "not enough stock on hand" }]);
  });

  it("trims the first edge: strips start after the trim, and the program's first group cuts it off as scrap", async () => {
    // 120 × 48 in sheets, 1/2 in trim: 47.5 in left, so three 12 in strips (not four) per sheet for 16 × 12 blanks
    const plan = await planBlanks(
      [{ length: 240, width: 96, count: null }],
      [{ label: "panel", length: 32, width: 24, quantity: 21 }],
      { trim: 1 },
    );
    checkPlan(
      plan,
      [{ length: 240, width: 96, count: null }],
      [{ label: "panel", length: 32, width: 24, quantity: 21 }],
      { trim: 1 },
    );
    expect(plan.patterns[0].cuts[0]).toMatchObject({ backgauge: 1, count: 1, scrap: true });
    expect(plan.patterns[0].strips[0].y).toBe(1);
    expect(plan.patterns[0].strips).toHaveLength(3); // hand arithmetic: 95 / 24 = 3.96
    expect(plan.patterns[0].offcuts.find((o) => o.kind === "trim")).toMatchObject({ y: 0, width: 1, reusable: false });
  });

  it("keeps within the shear: presents a sheet the other way round when it is longer than the blade; a piece beyond the backgauge's reach only as a remnant", async () => {
    const stock: Stock[] = [{ length: 3000, width: 1500, count: null }];
    const blanks: Blank[] = [
      { label: "a", length: 500, width: 400, quantity: 10, canTurn: true },
      { label: "long", length: 1400, width: 1200, quantity: 1, canTurn: true },
    ];
    const limits = { bladeLength: 2500, backgaugeMin: 10, backgaugeMax: 1000 };
    const plan = await planBlanks(stock, blanks, { limits });
    checkPlan(plan, stock, blanks);
    expect(plan.patterns.every((p) => p.rotated && p.length === 1500)).toBe(true); // 3000 > 2500 blade: the 1500 edge goes to the blade
    expect(plan.unplaced).toEqual([]); // the 1400 × 1200 blank: both edges beyond the 1000 backgauge, cut as what is left
    for (const p of plan.patterns)
      for (const c of p.cuts) if (c.count > 0) expect(c.backgauge).toBeLessThanOrEqual(1000);
    const narrow = await planBlanks(stock, [{ label: "wire", length: 500, width: 5, quantity: 2 }], { limits });
    expect(narrow.unplaced).toEqual([
      {
        blank: 0,
        quantity: 2,
        kind: "unplaceable",
        reason: expect.stringMatching(/narrower than the backgauge's nearest setting/),
      },
    ]);
    const none = await planBlanks([{ length: 3000, width: 2600, count: null }], blanks, { limits });
    expect(none.unusableStock).toEqual([0]);
    expect(none.unplaced.map((u) => u.kind)).toEqual(["unplaceable", "unplaceable"]);
  });

  it("a piece longer than the backgauge reaches is what is left once the spare behind it is cut off, in several strokes when one cannot reach", async () => {
    // 1300 > 1000: a 1300 × 700 panel is the last piece of its 2500 strip, the 1200 behind it cut off as 1000 + 200
    const stock: Stock[] = [{ length: 2500, width: 1250, count: null }];
    const blanks: Blank[] = [
      { label: "panel", length: 1300, width: 700, quantity: 10, canTurn: false },
      { label: "tab", length: 100, width: 100, quantity: 20, canTurn: false },
    ];
    const plan = await planBlanks(stock, blanks, {
      limits: { bladeLength: 3100, backgaugeMin: 5, backgaugeMax: 1000 },
    });
    checkPlan(plan, stock, blanks);
    expect(plan.unplaced).toEqual([]);
    // no two panels share a sheet (1300 + 1300 > 2500, 700 + 700 > 1250): 10 sheets, provably the fewest
    expect(plan.sheetsUsed).toBe(10);
    expect(plan.provenFewest).toBe(true);
    for (const p of plan.patterns)
      for (const c of p.cuts) if (c.count > 0) expect(c.backgauge).toBeLessThanOrEqual(1000);
    const lead = plan.patterns.flatMap((p) => p.cuts).filter((c) => c.scrap && c.turn);
    expect(lead.length).toBeGreaterThan(0);
    const cuts = plan.patterns.find((p) => p.cuts.some((c) => c.scrap && c.turn))!.cuts;
    const first = cuts.findIndex((c) => c.scrap && c.turn);
    expect(cuts.slice(first, first + 2).map((c) => [c.backgauge, c.count, c.scrap])).toEqual([
      [1000, 1, true],
      [200, 1, true],
    ]);
    expect(cuts[first + 2]).toMatchObject({ backgauge: 1300, count: 0 }); // the panel is what is left, no stroke
    // the spare behind each panel is kept as a 1000 × 700 offcut and a 200 × 700 one
    const ends = plan.patterns[0].offcuts.filter((o) => o.kind === "strip-end" && o.width === 700).map((o) => o.length);
    expect(ends.slice(0, 2)).toEqual([1000, 200]);
  });

  it("across the sheet too: a strip wider than the backgauge reaches is what is left once the sheet's spare comes off in strokes", async () => {
    // 2500 − 1300 = 1200 of the sheet's width before the 1300 strip: 1000 + 200; then 100 off the strip's 3000 length
    const stock: Stock[] = [{ length: 3000, width: 2500, count: null }];
    const blanks: Blank[] = [{ label: "plate", length: 2900, width: 1300, quantity: 2, canTurn: false }];
    const plan = await planBlanks(stock, blanks, {
      limits: { bladeLength: 3100, backgaugeMin: 5, backgaugeMax: 1000 },
    });
    checkPlan(plan, stock, blanks);
    expect(plan.unplaced).toEqual([]);
    expect(plan.sheetsUsed).toBe(2);
    const [pattern] = plan.patterns;
    expect(pattern.cuts.map((c) => [c.backgauge, c.count, c.scrap === true, c.turn === true])).toEqual([
      [1000, 1, true, false],
      [200, 1, true, false],
      [1300, 0, false, false],
      [100, 1, true, true],
      [2900, 0, false, false],
    ]);
    expect(pattern.offcuts.filter((o) => o.kind === "sheet-end").map((o) => [o.y, o.width])).toEqual([
      [0, 1000],
      [1000, 200],
    ]);
  });

  it("a piece beyond the reach whose spare cannot be cut within the travel is refused with the reason", async () => {
    // spare 2400 - 1300 = 1100: one stroke reaches at most 1000, two are at least 2 × 600 = 1200
    const stock: Stock[] = [{ length: 2400, width: 1250, count: null }];
    const blanks: Blank[] = [{ label: "panel", length: 1300, width: 700, quantity: 2, canTurn: false }];
    const plan = await planBlanks(stock, blanks, {
      limits: { bladeLength: 3100, backgaugeMin: 600, backgaugeMax: 1000 },
    });
    checkPlan(plan, stock, blanks);
    expect(plan.unplaced).toEqual([
      {
        blank: 0,
        quantity: 2,
        kind: "unplaceable",
        reason: expect.stringMatching(
          /longer than the backgauge reaches \(1000\).*cannot be cut off in strokes within the backgauge's travel \(600 to 1000\); 0 could be cut/,
        ),
      },
    ]);
  });

  it("over-production: never without an allowance, never beyond it, and said per blank", async () => {
    // 7 blanks 50 × 50 on 100 × 100 sheets: 4 per sheet, so 2 sheets hold 8; the eighth is an extra only with an allowance
    const stock: Stock[] = [{ length: 100, width: 100, count: null }];
    const blanks: Blank[] = [{ label: "sq", length: 50, width: 50, quantity: 7 }];
    const strict = await planBlanks(stock, blanks);
    expect(strict.produced).toEqual([7]);
    expect(strict.extra).toEqual([0]);
    const loose = await planBlanks(stock, blanks, { overProductionPct: 15 }); // floor(7 × 15 %) = 1 extra allowed
    checkPlan(loose, stock, blanks, { overProductionPct: 15 });
    expect(loose.produced).toEqual([8]);
    expect(loose.extra).toEqual([1]);
    expect(loose.sheetsUsed).toBe(2);
  });

  it("reusable offcuts: reported by size, and counted as stock returned in the net utilisation", async () => {
    // One 1200 × 400 blank on a 2000 × 1000 sheet: an 800 × 400 strip end and a 2000 × 600 sheet end are left
    const stock: Stock[] = [{ length: 2000, width: 1000, count: 1 }];
    const blanks: Blank[] = [{ label: "a", length: 1200, width: 400, quantity: 1 }];
    const plan = await planBlanks(stock, blanks, { reusable: { length: 500, width: 300 } });
    checkPlan(plan, stock, blanks);
    expect(plan.reusable).toEqual([
      { length: 2000, width: 600, count: 1 },
      { length: 800, width: 400, count: 1 },
    ]);
    expect(plan.utilisation).toBeCloseTo(0.24, 9); // 480 000 / 2 000 000
    expect(plan.netUtilisation).toBeCloseTo(1, 9); // 480 000 / (2 000 000 − 1 200 000 − 320 000)
    const none = await planBlanks(stock, blanks);
    expect(none.reusable).toEqual([]);
    expect(none.netUtilisation).toBeCloseTo(0.24, 9);
  });

  it("objectives: fewest sheets takes the bigger sheet, least waste the fuller one, fewest strokes avoids trimming cuts", async () => {
    // 30 × 20 blanks; a 100 × 60 sheet holds 9 (3 × 3, 100 % of 90 × 60 … 90 %), a 60 × 40 sheet holds 4 (100 %)
    const stock: Stock[] = [
      { length: 100, width: 60, count: null },
      { length: 60, width: 40, count: null },
    ];
    const blanks: Blank[] = [{ label: "b", length: 30, width: 20, quantity: 36, canTurn: false }];
    const sheets = await planBlanks(stock, blanks, { objective: "fewest_sheets" });
    const waste = await planBlanks(stock, blanks, { objective: "least_waste" });
    checkPlan(sheets, stock, blanks);
    checkPlan(waste, stock, blanks);
    expect(sheets.sheetsUsed).toBe(4); // hand arithmetic: 36 / 9
    expect(sheets.utilisation).toBeCloseTo(0.9, 9);
    expect(waste.sheetsUsed).toBe(9); // 36 / 4
    expect(waste.utilisation).toBeCloseTo(1, 9);
    // 4 of 60 × 30 and 4 of 40 × 28 on 100 × 60 sheets, grain fixed. Least waste: two 30 strips, each 60 × 30 + 40 × 28
    // with the 40 × 28 trimmed from 30 (5840 / 6000 = 97.3 %); per sheet 1 rip + 2 crosscuts + 2 trims = 5 strokes,
    // 2 strips + 2 pieces turned = 4 turns. Fewest strokes: the sheet presented the other way round, a 60 strip of two
    // 30-wide p and a 40 strip of two 28-wide q: the same 97.3 %, 1 + 1 + 2 = 4 strokes and 2 turns (hand arithmetic).
    const mixed: Blank[] = [
      { label: "p", length: 60, width: 30, quantity: 4, canTurn: false },
      { label: "q", length: 40, width: 28, quantity: 4, canTurn: false },
    ];
    const sheet: Stock[] = [{ length: 100, width: 60, count: null }];
    const lw = await planBlanks(sheet, mixed, { objective: "least_waste" });
    const fs = await planBlanks(sheet, mixed, { objective: "fewest_strokes" });
    checkPlan(lw, sheet, mixed);
    checkPlan(fs, sheet, mixed);
    expect([lw.sheetsUsed, fs.sheetsUsed]).toEqual([2, 2]);
    expect(lw.utilisation).toBeCloseTo(5840 / 6000, 9);
    expect(fs.utilisation).toBeCloseTo(5840 / 6000, 9);
    expect([lw.strokes, lw.turns]).toEqual([10, 8]);
    expect([fs.strokes, fs.turns]).toEqual([8, 4]);
    expect(fs.patterns.flatMap((p) => p.offcuts).filter((o) => o.kind === "piece-trim")).toEqual([]);
  });

  it("pieces of the same size from different order lines share a strip (the shear cannot tell them apart)", async () => {
    const stock: Stock[] = [{ length: 1000, width: 250, count: null }];
    const blanks: Blank[] = [
      { label: "a", length: 500, width: 250, quantity: 1 },
      { label: "b", length: 500, width: 250, quantity: 1 },
    ];
    const plan = await planBlanks(stock, blanks);
    checkPlan(plan, stock, blanks);
    expect(plan.sheetsUsed).toBe(1); // hand arithmetic: 2 × 500 = 1000
    expect(plan.patterns[0].strips[0].pieces.map((p) => p.blank).sort()).toEqual([0, 1]);
  });

  it("a cut that takes off the trim and spare width stays within the backgauge's travel", async () => {
    const stock: Stock[] = [{ length: 1000, width: 2010, count: null }];
    const blanks: Blank[] = [{ label: "a", length: 1000, width: 1000, quantity: 1, canTurn: false }];
    const limits = { bladeLength: 3100, backgaugeMin: 5, backgaugeMax: 1000 };
    const plan = await planBlanks(stock, blanks, { trim: 10, limits });
    checkPlan(plan, stock, blanks, { trim: 10 });
    expect(plan.sheetsUsed).toBe(1);
    for (const c of plan.patterns[0].cuts) {
      expect(c.backgauge).toBeGreaterThanOrEqual(5);
      expect(c.backgauge).toBeLessThanOrEqual(1000);
    }
  });

  it("on a 0.1 mm grid, spare width within the remnant tolerance does not cost a sheet", async () => {
    // 1000 × 1000.1 mm sheet (grid 0.1 mm): four 250 mm strips, the last 0.1 mm over (within 0.1 mm, our piece-flow rule)
    const stock: Stock[] = [{ length: 10000, width: 10001, count: null }];
    const blanks: Blank[] = [{ label: "s", length: 10000, width: 2500, quantity: 4, canTurn: false }];
    const plan = await planBlanks(stock, blanks, { mmPerUnit: 0.1 });
    expect(plan.sheetsUsed).toBe(1);
    expect(plan.produced).toEqual([4]);
  });

  it("holds its promises for any demand and any options (property)", async () => {
    const blank = fc.record({
      label: fc.constant("b"),
      length: fc.integer({ min: 1, max: 120 }),
      width: fc.integer({ min: 1, max: 80 }),
      quantity: fc.integer({ min: 0, max: 12 }),
      canTurn: fc.boolean(),
    });
    const sheet = fc.record({
      length: fc.integer({ min: 20, max: 150 }),
      width: fc.integer({ min: 20, max: 100 }),
      count: fc.option(fc.integer({ min: 0, max: 6 }), { nil: null }),
    });
    const options = fc.record({
      objective: fc.constantFrom("fewest_sheets", "least_waste", "fewest_strokes") as fc.Arbitrary<
        PlanOptions["objective"]
      >,
      trim: fc.integer({ min: 0, max: 5 }),
      overProductionPct: fc.integer({ min: 0, max: 30 }),
      reusable: fc.option(
        fc.record({ length: fc.integer({ min: 5, max: 60 }), width: fc.integer({ min: 5, max: 40 }) }),
        { nil: null },
      ),
      offcutsAsStock: fc.boolean(),
      limits: fc.option(
        fc.record({
          bladeLength: fc.integer({ min: 60, max: 160 }),
          backgaugeMin: fc.integer({ min: 1, max: 5 }),
          backgaugeMax: fc.integer({ min: 40, max: 120 }),
        }),
        { nil: null },
      ),
    });
    await fc.assert(
      fc.asyncProperty(
        fc.array(sheet, { minLength: 1, maxLength: 3 }),
        fc.array(blank, { minLength: 1, maxLength: 8 }),
        options,
        async (stock, blanks, o) => {
          const plan = await planBlanks(stock, blanks, o);
          checkPlan(plan, stock, blanks, o);
          if (o.limits)
            for (const p of plan.patterns) {
              expect(p.length).toBeLessThanOrEqual(o.limits.bladeLength);
              for (const c of p.cuts) {
                if (c.count === 0) continue; // names the remnant: no stroke, the backgauge is not set
                expect(c.backgauge).toBeLessThanOrEqual(o.limits.backgaugeMax);
                if (!(c.scrap && c.backgauge === o.trim))
                  expect(c.backgauge).toBeGreaterThanOrEqual(o.limits.backgaugeMin); // the trim is the caller's
              }
            }
          // unlimited stock of a usable size: nothing placeable is left over
          if (stock.every((s) => s.count === null))
            expect(plan.unplaced.filter((u) => u.kind === "stock_short")).toEqual([]);
        },
      ),
      { numRuns: 150, seed: 11 },
    );
  });

  it("holds its promises for any demand (property)", async () => {
    const blank = fc.record({
      label: fc.constant("b"),
      length: fc.integer({ min: 1, max: 120 }),
      width: fc.integer({ min: 1, max: 80 }),
      quantity: fc.integer({ min: 0, max: 12 }),
      canTurn: fc.boolean(),
    });
    const sheet = fc.record({
      length: fc.integer({ min: 20, max: 150 }),
      width: fc.integer({ min: 20, max: 100 }),
      count: fc.option(fc.integer({ min: 0, max: 6 }), { nil: null }),
    });
    await fc.assert(
      fc.asyncProperty(
        fc.array(sheet, { minLength: 1, maxLength: 3 }),
        fc.array(blank, { minLength: 1, maxLength: 8 }),
        async (stock, blanks) => {
          checkPlan(await planBlanks(stock, blanks), stock, blanks);
        },
      ),
      { numRuns: 150, seed: 7 },
    );
  });
});

describe("2D bin-packing classes (sheets against the area lower bound)", () => {
  const dir = path.resolve(import.meta.dirname, "..", "fixtures", "cutting", "CLASS", "json");
  const byClass = new Map<string, { sheets: number; area: number; bound: number; proven: number; n: number }>();
  beforeAll(async () => {
    for (const file of readdirSync(dir)
      .filter((name) => name.endsWith(".json"))
      .sort()) {
      const d = JSON.parse(readFileSync(path.join(dir, file), "utf8")) as {
        Name: string;
        Objects: { Length: number; Height: number }[];
        Items: { Length: number; Height: number; Demand: number }[];
      };
      const cls = d.Name.slice(0, 7);
      if (Number(d.Name.split("_")[2]) > 1) continue; // the first instance of every class and size keeps the suite quick (the benchmark takes three)
      const sheet = { length: d.Objects[0].Length, width: d.Objects[0].Height };
      const blanks: Blank[] = d.Items.map((it, i) => ({
        label: `i${i}`,
        length: it.Length,
        width: it.Height,
        quantity: it.Demand,
        canTurn: false,
      }));
      const stock: Stock[] = [{ ...sheet, count: null }];
      const plan = await planBlanks(stock, blanks, { columnGenerationBudget: 200_000_000 });
      checkPlan(plan, stock, blanks);
      expect(plan.unplaced, d.Name).toEqual([]); // unlimited stock: everything is placed
      const c = byClass.get(cls) ?? { sheets: 0, area: 0, bound: 0, proven: 0, n: 0 };
      c.sheets += plan.sheetsUsed;
      c.area += areaLowerBound(sheet, blanks);
      c.bound += plan.lowerBound;
      c.proven += plan.provenFewest ? 1 : 0;
      c.n += 1;
      byClass.set(cls, c);
    }
  }, 600_000);

  // Class 9 is mostly items larger than half the bin, so the area bound is far below any
  // packing there (from memory); every other class must stay within 25 % of it.
  const LIMIT: Record<string, number> = { CLASS09: 1.6 };
  it("stays within 25 % above the area bound (class 9: 60 %), never below the bound it states, and reports both", () => {
    const rows = [...byClass]
      .sort()
      .map(
        ([cls, c]) =>
          `${cls}: ${c.n} instances, ${c.sheets} sheets, area bound ${c.area} (×${(c.sheets / c.area).toFixed(3)}), stated bound ${c.bound}, ${c.proven} proven fewest`,
      );
    console.log(`two-stage planner on the bin-packing classes:\n  ${rows.join("\n  ")}`);
    expect(byClass.size).toBe(10);
    for (const [cls, c] of byClass) {
      expect(c.sheets / c.area, cls).toBeLessThanOrEqual(LIMIT[cls] ?? 1.25);
      expect(c.bound, cls).toBeGreaterThanOrEqual(c.area);
      expect(c.bound, cls).toBeLessThanOrEqual(c.sheets);
    }
  });
});

describe("one sheet of each gcut instance through the whole planner (program written and checked)", () => {
  // Demand larger than one sheet holds, sheets counted 1, no rotation (as in gcut). Target: the two-stage
  // values listed beside the data (computed independently, not published); bound: the published optimum.
  const rows: string[] = [];
  it.each(TABLE)("gcut%d", async (n, alongL, alongW, optimum) => {
    const { sheet, pieces } = gcut(n);
    const blanks: Blank[] = pieces.map((p, i) => ({
      label: `p${i}`,
      length: p.length,
      width: p.width,
      quantity: Math.ceil((sheet.length * sheet.width) / (p.length * p.width)) + 1,
      canTurn: false,
    }));
    const stock: Stock[] = [{ ...sheet, count: 1 }];
    const plan = await planBlanks(stock, blanks);
    checkPlan(plan, stock, blanks);
    expect(plan.sheetsUsed).toBe(1);
    const value = plan.patterns[0].strips.reduce(
      (s, st) => s + st.pieces.reduce((t, pc) => t + (pieces[pc.blank].value ?? 0), 0),
      0,
    );
    const target = Math.max(alongL, alongW);
    rows.push(
      `gcut${n}: ${value} (two-stage target ${target}, ${((100 * value) / target).toFixed(2)} %; optimum ${optimum})`,
    );
    expect(value).toBeLessThanOrEqual(optimum);
    expect(value).toBe(target); // every listed two-stage value, with the program for it written and checked
    if (n === 13) console.log(`planner, one sheet per gcut instance:\n  ${rows.join("\n  ")}`);
  });
});
