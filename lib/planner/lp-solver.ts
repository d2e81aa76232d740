/**
 * The LP solver for column generation: HiGHS compiled to WebAssembly (npm `highs`). Loading
 * compiles the WebAssembly once per process or worker thread (asynchronous); solving is
 * synchronous. Plans may pass their own instance (`PlanOptions.lpSolver`).
 */
import loadHighs, { type Highs } from "highs";

export type LpSolver = Highs;

let loading: Promise<LpSolver> | null = null;

/** The process's solver, loaded on first use. */
export function loadLpSolver(): Promise<LpSolver> {
  loading ??= loadHighs().catch((error: unknown) => {
    loading = null; // let a later plan try again
    throw error;
  });
  return loading;
}
