/**
 * The master problem of column generation, as a persistent LP in HiGHS: as few sheets as cover
 * the pieces still wanted (one row per blank, at least its demand), within the sheets on hand
 * (one row per counted stock size, at most its count), over the sheet patterns found so far
 * (one column each, costing one sheet). A piece may also go unplaced at a price of two sheets
 * (more than a sheet with it on costs), so the LP solves before any pattern is known and when
 * stock runs short, and its duals still price patterns; any plan that places everything is
 * feasible with none unplaced, so the LP still bounds its sheets. Disposed by `dispose()`.
 */
import type { Candidate } from "./candidates";
import type { LpSolver } from "./lp-solver";

/** Price of leaving one piece unplaced, in sheets: more than any sheet holding it costs. */
export const UNPLACED_PRICE = 2;

export interface MasterColumn {
  candidate: Candidate;
  stock: number;
  /** pieces per blank on one sheet */
  uses: Map<number, number>;
}

export interface MasterSolution {
  objective: number;
  /** sheets of each column */
  primal: Float64Array;
  /** price of one more piece of each blank (0 for blanks without a row) */
  blankPrice: Float64Array;
  /** extra price of one more sheet of each stock size (0 when not counted) */
  stockPrice: Float64Array;
  /** pieces left unplaced, over all blanks */
  unplaced: number;
  /** simplex iterations this solve took */
  iterations: number;
}

export class Master {
  readonly columns: MasterColumn[] = [];
  private readonly model: ReturnType<LpSolver["createModel"]>;
  private readonly blankRow = new Map<number, number>();
  private readonly stockRow = new Map<number, number>();
  private readonly slackColumns: number;
  private readonly keys = new Set<string>();

  constructor(
    private readonly solver: LpSolver,
    private readonly blankCount: number,
    demand: number[],
    private readonly onHand: (number | null)[],
  ) {
    this.model = solver.createModel();
    this.model.options.set({ output_flag: false, presolve: "off", solver: "simplex" });
    const none = { indices: [], values: [] };
    demand.forEach((count, blank) => {
      if (count <= 0) return;
      this.blankRow.set(blank, this.blankRow.size);
      this.model.addRow(count, solver.infinity, none);
    });
    onHand.forEach((count, stock) => {
      if (count === null) return;
      this.stockRow.set(stock, this.blankRow.size + this.stockRow.size);
      this.model.addRow(-solver.infinity, count, none);
    });
    for (const row of this.blankRow.values())
      this.model.addCol(UNPLACED_PRICE, 0, solver.infinity, { indices: [row], values: [1] });
    this.slackColumns = this.blankRow.size;
  }

  /** Is this pattern (its stock size and pieces) already a column? */
  has(stock: number, uses: Map<number, number>): boolean {
    return this.keys.has(keyOf(stock, uses));
  }

  add(column: MasterColumn): number {
    const indices: number[] = [];
    const values: number[] = [];
    for (const [blank, count] of [...column.uses].sort((a, b) => a[0] - b[0])) {
      const row = this.blankRow.get(blank);
      if (row === undefined) continue;
      indices.push(row);
      values.push(count);
    }
    const stockRow = this.stockRow.get(column.stock);
    if (stockRow !== undefined) {
      indices.push(stockRow);
      values.push(1);
    }
    this.model.addCol(1, 0, this.solver.infinity, { indices, values });
    this.keys.add(keyOf(column.stock, column.uses));
    this.columns.push(column);
    return this.columns.length - 1;
  }

  /** Pieces still wanted of a blank (the row's demand); blanks without a row stay at none. */
  setDemand(blank: number, count: number): void {
    const row = this.blankRow.get(blank);
    if (row !== undefined) this.model.changeRowBounds(row, count, this.solver.infinity);
  }

  setOnHand(stock: number, count: number): void {
    const row = this.stockRow.get(stock);
    if (row !== undefined) this.model.changeRowBounds(row, -this.solver.infinity, count);
  }

  /** A column that may no longer be cut (it would over-produce, or its stock is used up). */
  retire(column: number): void {
    this.model.changeColBounds(this.slackColumns + column, 0, 0);
  }

  solve(): MasterSolution | null {
    const before = Number(this.model.info.get("simplex_iteration_count") ?? 0);
    const run = this.model.run();
    const iterations = Math.max(0, Number(this.model.info.get("simplex_iteration_count") ?? 0) - before);
    if (run.modelStatus !== this.solver.constants.modelStatus.optimal) return null;
    const solution = this.model.getSolution();
    const blankPrice = new Float64Array(this.blankCount);
    for (const [blank, row] of this.blankRow) blankPrice[blank] = Math.max(0, solution.rowDual[row]);
    const stockPrice = new Float64Array(this.onHand.length);
    for (const [stock, row] of this.stockRow) stockPrice[stock] = Math.max(0, -solution.rowDual[row]);
    let unplaced = 0;
    for (let column = 0; column < this.slackColumns; column++) unplaced += solution.colValue[column];
    return {
      objective: this.model.getObjectiveValue(),
      primal: solution.colValue.slice(this.slackColumns),
      blankPrice,
      stockPrice,
      unplaced,
      iterations,
    };
  }

  dispose(): void {
    this.model.dispose();
  }
}

const keyOf = (stock: number, uses: Map<number, number>) =>
  `${stock}:${[...uses]
    .sort((a, b) => a[0] - b[0])
    .map(([blank, count]) => `${blank}x${count}`)
    .join(",")}`;
