/**
 * Sheets used against the lower bounds, order by order: 30 seeded random orders (3–25 blank
 * types on 2500 × 1250 or 3000 × 1500 mm sheets; large, small and awkward blanks, some not
 * turnable; a shear whose blade and backgauge do not bind), the first instance of every 2D
 * bin-packing class and size (Berkey & Wang 1987, Martello & Vigo 1998) and the first two of every
 * Hopper (2000) category, all from `tests/fixtures/cutting/`. Printed per order: the area bound,
 * the bound from pieces that cannot share a sheet, the LP bound (null when the area bound already proves the plan), Shearwire's sheets, those of
 * the pattern-by-pattern plan alone (no column generation), and the
 * bins of `maxrects-packer` (npm) as a reference, which packs without guillotine cuts: its
 * packing counts as cuttable on a shear only when every bin splits by edge-to-edge cuts
 * (checked). Run once each (`npm run bench`); no targets are asserted here.
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { MaxRectsPacker, Rectangle } from "maxrects-packer/dist/maxrects-packer.mjs";
import { bench, describe } from "vitest";
import { planBlanks, type Blank, type Plan, type Stock } from "../../lib/planner/plan";

interface Order {
  name: string;
  sheet: { length: number; width: number };
  blanks: Blank[];
}

/** Seeded random numbers (mulberry32, a public-domain generator): the same orders every run. */
function random(seed: number) {
  let state = seed;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let mixed = Math.imul(state ^ (state >>> 15), 1 | state);
    mixed = (mixed + Math.imul(mixed ^ (mixed >>> 7), 61 | mixed)) ^ mixed;
    return ((mixed ^ (mixed >>> 14)) >>> 0) / 4294967296;
  };
}

/** Invented orders: 30% large blanks, 40% small, 15% just over half the sheet's width, 15% long and narrow; a quarter not turnable. */
function randomOrders(): Order[] {
  const next = random(20260101);
  const between = (low: number, high: number) => low + Math.floor(next() * (high - low + 1));
  return Array.from({ length: 30 }, (_, index) => {
    const sheet = index % 2 ? { length: 3000, width: 1500 } : { length: 2500, width: 1250 };
    const blanks: Blank[] = Array.from({ length: between(3, 25) }, (__, line) => {
      const kind = next();
      let size: [number, number, number];
      if (kind < 0.3) size = [between(600, 1800), between(400, 1100), between(1, 12)];
      else if (kind < 0.7) size = [between(80, 400), between(50, 300), between(5, 80)];
      else if (kind < 0.85) size = [between(300, 1200), Math.floor(sheet.width / 2) + between(10, 150), between(1, 15)];
      else size = [between(1500, sheet.length - 100), between(60, 200), between(1, 15)];
      return { label: `R${index}/${line}`, length: size[0], width: size[1], quantity: size[2], canTurn: next() < 0.75 };
    });
    return { name: `random ${index + 1}`, sheet, blanks };
  });
}

const FIXTURES = path.resolve(import.meta.dirname, "..", "fixtures", "cutting");

/** Published instances (JSON: one bin size; items with demand), items fixed in direction as in the 2D bin-packing literature. */
function published(folder: string, keep: (name: string) => boolean): Order[] {
  const dir = path.join(FIXTURES, folder, "json");
  return readdirSync(dir)
    .filter((file) => file.endsWith(".json"))
    .map(
      (file) =>
        JSON.parse(readFileSync(path.join(dir, file), "utf8")) as {
          Name: string;
          Objects: { Length: number; Height: number }[];
          Items: { Length: number; Height: number; Demand: number }[];
        },
    )
    .filter((data) => keep(data.Name))
    .sort((a, b) => a.Name.localeCompare(b.Name))
    .map((data) => ({
      name: data.Name,
      sheet: { length: data.Objects[0].Length, width: data.Objects[0].Height },
      blanks: data.Items.map((item, index) => ({
        label: `${data.Name}/${index}`,
        length: item.Length,
        width: item.Height,
        quantity: item.Demand,
        canTurn: false,
      })),
    }));
}

/** Can the rectangles in this region be separated by edge-to-edge cuts, again and again, down to single pieces? */
function guillotine(rects: { x: number; y: number; width: number; height: number }[]): boolean {
  if (rects.length <= 1) return true;
  for (const axis of ["x", "y"] as const) {
    const size = axis === "x" ? "width" : "height";
    for (const cut of new Set(rects.map((rect) => rect[axis] + rect[size]))) {
      if (rects.some((rect) => rect[axis] < cut && rect[axis] + rect[size] > cut)) continue;
      const before = rects.filter((rect) => rect[axis] + rect[size] <= cut);
      if (before.length === 0 || before.length === rects.length) continue;
      return guillotine(before) && guillotine(rects.filter((rect) => rect[axis] >= cut));
    }
  }
  return false;
}

/** Bins `maxrects-packer` uses (turning only blanks that may turn), and whether every bin is a guillotine packing. */
function reference(order: Order): { bins: number; guillotine: boolean } {
  const packer = new MaxRectsPacker<Rectangle>(order.sheet.length, order.sheet.width, 0, {
    smart: false,
    pot: false,
    square: false,
    allowRotation: true,
    border: 0,
  });
  const rects: Rectangle[] = [];
  for (const blank of order.blanks)
    for (let copy = 0; copy < blank.quantity; copy++)
      rects.push(new Rectangle(blank.length, blank.width, 0, 0, false, blank.canTurn ?? true));
  packer.addArray(rects);
  return { bins: packer.bins.length, guillotine: packer.bins.every((bin) => guillotine(bin.rects)) };
}

interface Row {
  order: Order;
  plan: Plan;
  milliseconds: number;
  greedy: number;
  maxrects: { bins: number; guillotine: boolean };
}
const rows: Row[] = [];

/** A shear whose blade and backgauge reach every sheet and blank here. */
const FREE_SHEAR = { bladeLength: 3200, backgaugeMin: 1, backgaugeMax: 3200 };

const runs = new Map<string, Promise<void>>();
/** Plan every order once (the bench may call again: later calls wait for the first) and print the table. */
const run = (title: string, orders: () => Order[], limits: typeof FREE_SHEAR | null): Promise<void> => {
  if (!runs.has(title)) runs.set(title, planAll(title, orders(), limits));
  return runs.get(title)!;
};

async function planAll(title: string, orders: Order[], limits: typeof FREE_SHEAR | null): Promise<void> {
  const mine: Row[] = [];
  for (const order of orders) {
    const stock: Stock[] = [{ ...order.sheet, count: null }];
    const started = performance.now();
    const plan = await planBlanks(stock, order.blanks, { limits });
    const milliseconds = performance.now() - started;
    const greedy = (await planBlanks(stock, order.blanks, { limits, columnGenerationBudget: 0 })).sheetsUsed;
    mine.push({ order, plan, milliseconds, greedy, maxrects: reference(order) });
  }
  rows.push(...mine);
  const line = (row: Row) => {
    const { plan } = row;
    const gap = plan.sheetsUsed - plan.lowerBound;
    return `${row.order.name.padEnd(16)} ${String(row.order.blanks.length).padStart(3)} types  area ${String(plan.bounds.area).padStart(3)}  apart ${String(plan.bounds.apart ?? "-").padStart(3)}  LP ${String(plan.bounds.lp ?? "-").padStart(3)}  Shearwire ${String(plan.sheetsUsed).padStart(3)}${gap ? ` (+${gap})` : "     "}  greedy alone ${String(row.greedy).padStart(3)}  maxrects ${String(row.maxrects.bins).padStart(3)}${row.maxrects.guillotine ? " guillotine" : "           "}  ${plan.method === "greedy" ? "greedy" : "c.g.  "} ${row.milliseconds.toFixed(0).padStart(6)} ms${plan.methodNote ? "  (budget ran out)" : ""}`;
  };
  console.log(`\n${title}\n  ${mine.map(line).join("\n  ")}\n  ${totals(mine)}`);
}

function totals(of: Row[]): string {
  const sum = (value: (row: Row) => number) => of.reduce((total, row) => total + value(row), 0);
  const bound = sum((row) => row.plan.lowerBound);
  const sheets = sum((row) => row.plan.sheetsUsed);
  const cuttable = of.filter((row) => row.maxrects.guillotine);
  const worse = cuttable.filter((row) => row.plan.sheetsUsed > row.maxrects.bins).map((row) => row.order.name);
  const worst = of.reduce((most, row) => Math.max(most, row.plan.sheetsUsed - row.plan.lowerBound), 0);
  return [
    `totals over ${of.length}: area bound ${sum((row) => row.plan.bounds.area)}, LP bound ${sum((row) => row.plan.bounds.lp ?? 0)} where computed, lower bound ${bound}, Shearwire ${sheets} (${((100 * (sheets - bound)) / bound).toFixed(2)} % above), greedy alone ${sum((row) => row.greedy)}, maxrects ${sum((row) => row.maxrects.bins)}`,
    `worst gap ${worst} sheet(s); proven fewest ${of.filter((row) => row.plan.provenFewest).length} of ${of.length}; plan time ${(sum((row) => row.milliseconds) / 1000).toFixed(1)} s in all, ${Math.max(...of.map((row) => row.milliseconds)).toFixed(0)} ms at most`,
    `maxrects packing guillotine in ${cuttable.length} orders; Shearwire uses more sheets than it in ${worse.length} of them${worse.length ? `: ${worse.join(", ")}` : ""}`,
  ].join("\n  ");
}

const ONCE = { iterations: 1, warmupIterations: 0, time: 0, warmupTime: 0 };

describe("sheets against the lower bounds", () => {
  bench(
    "30 random orders on 2500 × 1250 and 3000 × 1500 mm",
    () => run("random orders (a shear that does not bind)", randomOrders, FREE_SHEAR),
    ONCE,
  );
  bench(
    "2D bin-packing classes, first instance of each class and size",
    () =>
      run(
        "bin-packing classes (Berkey & Wang; Martello & Vigo)",
        () => published("CLASS", (name) => name.endsWith("_01")),
        null,
      ),
    ONCE,
  );
  bench(
    "Hopper instances, first two of each category",
    async () => {
      const first = !runs.has("Hopper (2000)");
      await run("Hopper (2000)", () => published("HOPPER", (name) => /[ab]$/.test(name)), null);
      if (first) console.log(`\nall orders\n  ${totals(rows)}`);
    },
    ONCE,
  );
});
