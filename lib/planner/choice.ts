/**
 * Which of two plans for the same order the objective prefers, and the lower bounds a plan
 * can state about itself. Every plan first places as much of what was asked as it can.
 */
import type { PlanSetup } from "./candidates";
import type { Variant } from "./presentation";
import { quantities } from "./summary";
import type { PlanBody } from "./summary";
import { STROKES_UTILISATION_SLACK, type SheetPattern } from "./types";

const stockArea = (plan: PlanBody) =>
  plan.patterns.reduce((sum, pattern) => sum + pattern.length * pattern.width * pattern.repeats, 0);

/** Blank area placed, counting no piece beyond the quantity asked. */
export function placedArea(setup: PlanSetup, produced: number[]): number {
  const quantity = quantities(setup);
  return setup.blanks.reduce(
    (sum, blank, index) => sum + blank.length * blank.width * Math.min(produced[index], quantity[index]),
    0,
  );
}

const blankArea = (plan: PlanBody) =>
  plan.patterns.reduce(
    (sum, pattern) =>
      sum +
      pattern.repeats *
        pattern.strips.reduce(
          (strips, strip) => strips + strip.pieces.reduce((pieces, piece) => pieces + piece.length * piece.width, 0),
          0,
        ),
    0,
  );

const reusableArea = (patterns: SheetPattern[]) =>
  patterns.reduce(
    (sum, pattern) =>
      sum +
      pattern.repeats *
        pattern.offcuts.reduce((offcuts, offcut) => offcuts + (offcut.reusable ? offcut.length * offcut.width : 0), 0),
    0,
  );

/**
 * True when the objective prefers `challenger` to `holder` (ties keep the holder). `fewest_sheets`:
 * fewer sheets, then less stock area; `least_waste`: less stock area not in blanks (nor in kept
 * offcuts, when they count as stock), then fewer sheets; `fewest_strokes`: among plans within
 * the slack of the fuller's utilisation, fewer strokes and turns per blank, then fewer sheets.
 */
export function prefers(setup: PlanSetup, challenger: PlanBody, holder: PlanBody): boolean {
  const placed = placedArea(setup, challenger.produced) - placedArea(setup, holder.produced);
  if (placed !== 0) return placed > 0;
  const { objective, offcutsAsStock } = setup.options;
  const sheets = challenger.sheetsUsed - holder.sheetsUsed;
  const area = stockArea(challenger) - stockArea(holder);
  const waste = (plan: PlanBody) =>
    stockArea(plan) - blankArea(plan) - (offcutsAsStock ? reusableArea(plan.patterns) : 0);
  const fill = (plan: PlanBody) =>
    stockArea(plan) ? (blankArea(plan) + (offcutsAsStock ? reusableArea(plan.patterns) : 0)) / stockArea(plan) : 0;
  const pieces = (plan: PlanBody) => plan.produced.reduce((sum, count) => sum + count, 0) || 1;
  const handling = (plan: PlanBody) => (plan.strokes + plan.turns) / pieces(plan);
  switch (objective) {
    case "least_waste": {
      const difference = waste(challenger) - waste(holder);
      return difference !== 0 ? difference < 0 : sheets < 0;
    }
    case "fewest_strokes": {
      const top = Math.max(fill(challenger), fill(holder));
      const near = (plan: PlanBody) => fill(plan) >= top - STROKES_UTILISATION_SLACK;
      if (near(challenger) !== near(holder)) return near(challenger);
      const difference = handling(challenger) - handling(holder);
      return Math.abs(difference) > 1e-12 ? difference < 0 : sheets < 0;
    }
    default:
      return sheets !== 0 ? sheets < 0 : area < 0;
  }
}

/** The ways the sheets on hand meet the blade (stock with a count of 0 is not on hand). */
const onHandWays = (setup: PlanSetup) => setup.presentations.filter((way) => setup.stock[way.stock].count !== 0);

/** The largest usable area of a sheet on hand (0: none). */
const largestUsable = (setup: PlanSetup) =>
  Math.max(0, ...onHandWays(setup).map((way) => way.length * way.usableWidth));

/** Sheets any plan needs for this much blank area: on the largest usable sheet on hand, no fewer. */
export function areaBound(setup: PlanSetup, area: number): number {
  const largest = largestUsable(setup);
  return largest > 0 ? Math.ceil(area / largest) : 0;
}

/**
 * Sheets any plan needs because some pieces cannot share a sheet. Two pieces share one only side by side,
 * along it or across it (two rectangles that fit on a sheet can always be parted by one straight cut), so
 * pieces no two of which fit side by side on any sheet on hand, either way round they may lie, each take a
 * sheet of their own: a set of them, gathered greedily (any such set bounds the sheets), counts a sheet
 * each. Gathered from the blanks whose own copies cannot share a sheet, the pieces that can share one with
 * none of them need further sheets, at least their area's worth. The same reasoning about pieces larger
 * than half the sheet underlies the classic lower bounds for two-dimensional bin packing (Martello and
 * Vigo, 1998). `counts` are pieces per blank.
 */
export function apartBound(setup: PlanSetup, counts: number[]): number {
  const ways = onHandWays(setup);
  const largest = largestUsable(setup);
  if (largest === 0) return 0;
  const variants = ways.map((way) => {
    const of = new Map<number, Variant[]>();
    for (const variant of way.variants) of.set(variant.blank, [...(of.get(variant.blank) ?? []), variant]);
    return of;
  });
  const memo = new Map<number, boolean>();
  const share = (a: number, b: number): boolean => {
    const key = Math.min(a, b) * counts.length + Math.max(a, b);
    let shared = memo.get(key);
    if (shared === undefined) {
      shared = ways.some((way, index) => {
        const [first, second] = [variants[index].get(a), variants[index].get(b)];
        return Boolean(
          first?.some((one) =>
            second?.some(
              (other) =>
                (one.length + other.length <= way.length && Math.max(one.width, other.width) <= way.usableWidth) ||
                (one.width + other.width <= way.usableWidth && Math.max(one.length, other.length) <= way.length),
            ),
          ),
        );
      });
      memo.set(key, shared);
    }
    return shared;
  };
  const present = counts.flatMap((count, blank) => (count > 0 ? [blank] : []));
  const size = setup.blanks.map((blank) => [blank.length * blank.width, blank.length, blank.width]);
  let best = 0;
  for (const measure of [0, 1, 2]) {
    const order = [...present].sort((a, b) => size[b][measure] - size[a][measure] || a - b);
    // every blank that can share a sheet with none gathered so far: a sheet for each piece that cannot share with its own
    const all: number[] = [];
    let sheets = 0;
    for (const blank of order)
      if (all.every((other) => !share(blank, other))) {
        all.push(blank);
        sheets += share(blank, blank) ? 1 : counts[blank];
      }
    best = Math.max(best, sheets);
    // only blanks whose copies cannot share, then the area of what can share a sheet with none of them
    const alone = order.filter((blank) => !share(blank, blank));
    const gathered: number[] = [];
    for (const blank of alone) if (gathered.every((other) => !share(blank, other))) gathered.push(blank);
    const apart = gathered.reduce((sum, blank) => sum + counts[blank], 0);
    const rest = present
      .filter((blank) => !gathered.includes(blank) && gathered.every((other) => !share(blank, other)))
      .reduce((sum, blank) => sum + counts[blank] * size[blank][0], 0);
    best = Math.max(best, apart + Math.ceil(rest / largest));
  }
  return best;
}
