/**
 * Whole sheets from all the patterns column generation found: the master problem with whole
 * numbers of sheets, a small integer program over those patterns solved by HiGHS's branch and
 * bound within a node limit (counted, so plans stay reproducible), started from the plan the
 * rounding made. It may cut more of a blank than asked: pieces the allowance does not cover
 * are then taken off sheets that carry them, and those sheets' programs written again.
 */
import { writeCandidate, type Candidate, type PlanSetup } from "./candidates";
import type { Residual } from "./column-generation";
import type { LpSolver } from "./lp-solver";
import type { StripIn } from "./written";

export interface SheetUse {
  candidate: Candidate;
  count: number;
}

/** Branch-and-bound nodes the integer program may take. */
export const WHOLE_SHEET_NODES = 3000;

/**
 * The fewest whole sheets over `columns` that cover `residual.wanted` within the stock, if fewer
 * than `start` uses; null otherwise (or when the solver gives up). `work` is told the effort.
 */
export function fewerWholeSheets(
  solver: LpSolver,
  columns: Candidate[],
  residual: Residual,
  start: SheetUse[],
  work: (cells: number) => void,
): SheetUse[] | null {
  const startSheets = start.reduce((sum, use) => sum + use.count, 0);
  const rows = new Map<number, number>();
  residual.wanted.forEach((count, blank) => {
    if (count > 0) rows.set(blank, rows.size);
  });
  const stockRows = new Map<number, number>();
  residual.onHand.forEach((count, stock) => {
    if (count !== null) stockRows.set(stock, rows.size + stockRows.size);
  });
  const model = solver.createModel();
  try {
    model.options.set({
      output_flag: false,
      presolve: "off",
      mip_max_nodes: WHOLE_SHEET_NODES,
      mip_rel_gap: 0,
      mip_pscost_minreliable: 0,
      mip_detect_symmetry: false,
    });
    const none = { indices: [], values: [] };
    for (const blank of rows.keys()) model.addRow(residual.wanted[blank], solver.infinity, none);
    for (const stock of stockRows.keys()) model.addRow(-solver.infinity, residual.onHand[stock]!, none);
    columns.forEach((candidate, column) => {
      const indices: number[] = [];
      const values: number[] = [];
      for (const [blank, count] of [...candidate.uses].sort((a, b) => a[0] - b[0])) {
        const row = rows.get(blank);
        if (row !== undefined) {
          indices.push(row);
          values.push(count);
        }
      }
      const stockRow = stockRows.get(candidate.way.stock);
      if (stockRow !== undefined) {
        indices.push(stockRow);
        values.push(1);
      }
      model.addCol(1, 0, solver.infinity, { indices, values });
      model.changeColIntegrality(column, solver.constants.variableType.integer);
    });
    const startValue = new Float64Array(columns.length); // every sheet of the start is among the columns
    for (const use of start) startValue[columns.indexOf(use.candidate)] += use.count;
    model.setSolution({ colValue: startValue });
    model.run();
    work(Number(model.info.get("mip_node_count") ?? 0) * (columns.length + rows.size) * 200);
    const status = model.getModelStatus();
    const { optimal, solutionLimit, iterationLimit, unknown } = solver.constants.modelStatus;
    if (![optimal, solutionLimit, iterationLimit, unknown].includes(status as never)) return null;
    const value = model.getSolution().colValue;
    const uses: SheetUse[] = [];
    value.forEach((sheets, column) => {
      const count = Math.round(sheets);
      if (count > 0) uses.push({ candidate: columns[column], count });
    });
    const total = uses.reduce((sum, use) => sum + use.count, 0);
    const covers = [...rows.keys()].every(
      (blank) =>
        uses.reduce((sum, use) => sum + (use.candidate.uses.get(blank) ?? 0) * use.count, 0) >= residual.wanted[blank],
    );
    return covers && total < startSheets ? uses : null;
  } finally {
    model.dispose();
  }
}

/**
 * Take pieces beyond what is wanted plus the allowance off the sheets that carry them (a copy of
 * a sheet at a time, its program written again). Pieces a rewritten program cannot keep are
 * left for the caller to place. Returns the sheets and what they make per blank.
 */
export function withoutSurplus(
  setup: PlanSetup,
  uses: SheetUse[],
  residual: Residual,
): { uses: SheetUse[]; produced: number[] } {
  const produced = residual.wanted.map(() => 0);
  for (const use of uses) for (const [blank, count] of use.candidate.uses) produced[blank] += count * use.count;
  const result = uses.map((use) => ({ ...use }));
  residual.wanted.forEach((wanted, blank) => {
    let surplus = produced[blank] - wanted - residual.allowance[blank];
    // Fullest sheets keep their pieces; surplus comes off the emptiest first.
    const carriers = result
      .filter((use) => use.candidate.uses.has(blank))
      .sort((a, b) => a.candidate.blanksArea - b.candidate.blanksArea);
    for (const use of carriers) {
      while (surplus > 0 && use.count > 0) {
        const drop = Math.min(surplus, use.candidate.uses.get(blank)!);
        let left = drop;
        const strips: StripIn[] = use.candidate.strips
          .map((strip) => ({
            width: strip.width,
            pieces: [...strip.pieces]
              .reverse()
              .filter((piece) => !(piece.blank === blank && left > 0 && left-- > 0))
              .reverse(),
          }))
          .filter((strip) => strip.pieces.length > 0);
        use.count -= 1;
        const rewritten = strips.length ? writeCandidate(setup, use.candidate.way, strips, () => true) : null;
        for (const [other, count] of use.candidate.uses) produced[other] -= count;
        if (rewritten) {
          result.push({ candidate: rewritten, count: 1 });
          for (const [other, count] of rewritten.uses) produced[other] += count;
        }
        surplus = produced[blank] - wanted - residual.allowance[blank];
      }
    }
  });
  return { uses: result.filter((use) => use.count > 0), produced };
}
