/**
 * Remnants first: when some stock rows are remnants, the blanks are planned on the remnants
 * alone, and what they cannot take is then planned on the other rows. Both passes are the
 * ordinary planner, so the plan stays deterministic; the pieces a remnant can carry never go
 * onto a full sheet. The stated lower bound is the area bound over every sheet size offered
 * (a plan that may use full sheets for everything can need no fewer), so it stays a true bound.
 */
import { planBlanks } from "./plan";
import type { Blank, Plan, PlanOptions, Stock } from "./types";

const areaOf = (plan: Plan, stock: Stock[]) =>
  plan.patterns.reduce((sum, p) => sum + stock[p.stock].length * stock[p.stock].width * p.repeats, 0);

function mergeReusable(first: Plan["reusable"], second: Plan["reusable"]): Plan["reusable"] {
  const merged = new Map<string, Plan["reusable"][number]>();
  for (const offcut of [...first, ...second]) {
    const key = `${offcut.length}x${offcut.width}`;
    const had = merged.get(key);
    merged.set(key, had ? { ...had, count: had.count + offcut.count } : { ...offcut });
  }
  return [...merged.values()];
}

/**
 * Plan `blanks` on `stock`, the rows marked in `remnant` first. Without remnants (or with only
 * remnants) this is `planBlanks` itself.
 */
export async function planRemnantsFirst(
  stock: Stock[],
  blanks: Blank[],
  remnant: boolean[],
  options: PlanOptions = {},
): Promise<Plan> {
  if (!remnant.some(Boolean) || remnant.every(Boolean)) return planBlanks(stock, blanks, options);
  const only = (keep: boolean) => stock.map((s, i) => (remnant[i] === keep ? s : { ...s, count: 0 }));
  const first = await planBlanks(only(true), blanks, { ...options, onProgress: undefined });
  const rest = blanks.map((b, i) => ({ ...b, quantity: Math.max(0, b.quantity - first.produced[i]) }));
  const second = await planBlanks(only(false), rest, options);

  const [areaFirst, areaSecond] = [areaOf(first, stock), areaOf(second, stock)];
  const stockArea = areaFirst + areaSecond;
  const weighted = (u1: number, u2: number) => (stockArea > 0 ? (u1 * areaFirst + u2 * areaSecond) / stockArea : 0);
  const produced = first.produced.map((n, i) => n + second.produced[i]);
  const placedArea = produced.reduce(
    (sum, n, i) => sum + Math.min(n, blanks[i].quantity) * blanks[i].length * blanks[i].width,
    0,
  );
  const largest = Math.max(0, ...stock.filter((s) => s.count !== 0).map((s) => s.length * s.width));
  const lowerBound = largest > 0 ? Math.ceil(placedArea / largest - 1e-9) : 0;
  const sheetsUsed = first.sheetsUsed + second.sheetsUsed;
  const notes = [
    `Remnants were planned first (${first.sheetsUsed} used), then full sheets for the rest.`,
    first.methodNote,
    second.methodNote,
  ];
  return {
    patterns: [...first.patterns, ...second.patterns],
    sheetsUsed,
    produced,
    extra: first.extra.map((n, i) => n + second.extra[i]),
    unplaced: second.unplaced,
    unusableStock: [...new Set([...first.unusableStock, ...second.unusableStock])].sort((a, b) => a - b),
    utilisation: weighted(first.utilisation, second.utilisation),
    netUtilisation: weighted(first.netUtilisation, second.netUtilisation),
    reusable: mergeReusable(first.reusable, second.reusable),
    strokes: first.strokes + second.strokes,
    turns: first.turns + second.turns,
    method: second.sheetsUsed > 0 ? second.method : first.method,
    methodNote: notes.filter(Boolean).join(" "),
    bounds: { area: lowerBound, apart: null, lp: null },
    lowerBound,
    provenFewest: sheetsUsed <= lowerBound,
  };
}
