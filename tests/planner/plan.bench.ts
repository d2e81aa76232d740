/**
 * Plan time. 30 blank types (500 pieces) onto three sheet sizes: target under 2 s. The largest
 * orders a plan takes (200 blank types; 1000 pieces, and 20 000, the most `PLAN_LIMITS` allows):
 * no target here, but they must end well inside the worker's 60 s; the work budget of column
 * generation bounds them. Each reports its sheets beside the lower bound it proved.
 */
import { bench, describe } from "vitest";
import { PLAN_LIMITS } from "../../lib/planner/order";
import { planBlanks, type Blank, type Plan, type Stock } from "../../lib/planner/plan";

// A fixed, invented order book (demo data): 30 blank types, 500 pieces in all.
let seed = 20261202;
const rand = (n: number) => ((seed = (seed * 1103515245 + 12345) % 2 ** 31), seed % n);
const blanks: Blank[] = Array.from({ length: 30 }, (_, i) => ({
  label: `B${i + 1}`,
  length: 100 + rand(900),
  width: 50 + rand(450),
  quantity: 0,
  canTurn: i % 3 !== 0,
}));
for (let k = 0; k < 500; k++) blanks[k % 30].quantity += 1;
const stock: Stock[] = [
  { length: 3000, width: 1500, count: null },
  { length: 2500, width: 1250, count: null },
  { length: 2000, width: 1000, count: null },
];

const describePlan = (plan: Plan) =>
  `${plan.sheetsUsed} sheets, ${(plan.utilisation * 100).toFixed(1)} % of their area is blanks; lower bound ${plan.lowerBound} (area ${plan.bounds.area}, LP ${plan.bounds.lp ?? "-"})${plan.provenFewest ? ", provably the fewest" : ""}; ${plan.method}${plan.methodNote ? ` (${plan.methodNote})` : ""}`;

const timed = async (run: () => Promise<Plan>) => {
  const started = performance.now();
  const plan = await run();
  return `${describePlan(plan)}; ${((performance.now() - started) / 1000).toFixed(2)} s`;
};

describe("planner", () => {
  bench(
    "30 blank types, 500 pieces, 3 sheet sizes",
    async () => {
      await planBlanks(stock, blanks);
    },
    {
      iterations: 5,
      teardown: async () => console.log(`plan: ${await timed(() => planBlanks(stock, blanks))} (target time < 2 s)`),
    },
  );
  bench(
    "the same, objective fewest strokes and turns",
    async () => {
      await planBlanks(stock, blanks, { objective: "fewest_strokes" });
    },
    {
      iterations: 3,
      teardown: async () => {
        const plan = await planBlanks(stock, blanks, { objective: "fewest_strokes" });
        const sheets = await planBlanks(stock, blanks);
        console.log(
          `fewest strokes: ${plan.sheetsUsed} sheets, ${(plan.utilisation * 100).toFixed(1)} %, ${plan.strokes} strokes and ${plan.turns} turns (fewest sheets: ${sheets.strokes} strokes and ${sheets.turns} turns)`,
        );
      },
    },
  );
  // The largest orders a plan takes: 200 blank types (the schema's limit) with 1000 pieces, and with
  // the 20 000 pieces PLAN_LIMITS allows. No target; the work budgets keep them to seconds.
  const many = (pieces: number): Blank[] => {
    const types: Blank[] = Array.from({ length: PLAN_LIMITS.blankTypes }, (_, i) => ({
      label: `M${i + 1}`,
      length: 100 + rand(900),
      width: 50 + rand(450),
      quantity: 0,
      canTurn: i % 4 !== 0,
    }));
    for (let k = 0; k < pieces; k++) types[k % types.length].quantity += 1;
    return types;
  };
  const thousand = many(1000);
  bench(
    "200 blank types, 1000 pieces, 3 sheet sizes",
    async () => {
      console.log(`200 types, 1000 pieces: ${await timed(() => planBlanks(stock, thousand))}`);
    },
    { iterations: 1, warmupIterations: 0, time: 0, warmupTime: 0 },
  );
  const largest = many(PLAN_LIMITS.totalPieces);
  bench(
    "200 blank types, 20 000 pieces (the largest order), 3 sheet sizes",
    async () => {
      console.log(`200 types, ${PLAN_LIMITS.totalPieces} pieces: ${await timed(() => planBlanks(stock, largest))}`);
    },
    { iterations: 1, warmupIterations: 0, time: 0, warmupTime: 0 },
  );
});
