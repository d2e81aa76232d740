/** Planning 30 blank types (500 pieces) onto three sheet sizes; target under 2 s. Reports utilisation beside the area bound. */
import { bench, describe } from "vitest";
import { areaLowerBound, planBlanks, type Blank, type Stock } from "../../lib/planner/plan";

// A fixed, invented order book (demo data): 30 blank types, 500 pieces in all.
let seed = 20261202;
const rand = (n: number) => ((seed = (seed * 1103515245 + 12345) % 2 ** 31), seed % n);
const blanks: Blank[] = Array.from({ length: 30 }, (_, i) => ({
  label: `B${i + 1}`, length: 100 + rand(900), width: 50 + rand(450), quantity: 0, canTurn: i % 3 !== 0,
}));
for (let k = 0; k < 500; k++) blanks[k % 30].quantity += 1;
const stock: Stock[] = [{ length: 3000, width: 1500, count: null }, { length: 2500, width: 1250, count: null }, { length: 2000, width: 1000, count: null }];

describe("planner", () => {
  bench("30 blank types, 500 pieces, 3 sheet sizes", async () => {
    await planBlanks(stock, blanks);
  }, {
    iterations: 5,
    teardown: async () => {
      const plan = await planBlanks(stock, blanks);
      console.log(`plan: ${plan.sheetsUsed} sheets, ${(plan.utilisation * 100).toFixed(1)} % of their area is blanks (the area bound is 100 %); at least ${areaLowerBound(stock[0], blanks)} sheets even if all were the largest size (target time < 2 s)`);
    },
  });
  bench("the same, objective fewest strokes and turns", async () => {
    await planBlanks(stock, blanks, { objective: "fewest_strokes" });
  }, {
    iterations: 3,
    teardown: async () => {
      const plan = await planBlanks(stock, blanks, { objective: "fewest_strokes" });
      const sheets = await planBlanks(stock, blanks);
      console.log(`fewest strokes: ${plan.sheetsUsed} sheets, ${(plan.utilisation * 100).toFixed(1)} %, ${plan.strokes} strokes and ${plan.turns} turns (fewest sheets: ${sheets.strokes} strokes and ${sheets.turns} turns)`);
    },
  });
  // The largest order a plan takes: 200 blank types (the schema's limit), 1000 pieces. No target; the
  // knapsack work budget (PLAN_WORK_BUDGET) keeps it to seconds.
  const many: Blank[] = Array.from({ length: 200 }, (_, i) => ({ label: `M${i + 1}`, length: 100 + rand(900), width: 50 + rand(450), quantity: 5, canTurn: i % 4 !== 0 }));
  bench("200 blank types, 1000 pieces, 3 sheet sizes", async () => {
    await planBlanks(stock, many);
  }, { iterations: 2 });
});
