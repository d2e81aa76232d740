/**
 * The gcut instances (Beasley 1985, OR-Library; unconstrained, no rotation) from
 * `tests/fixtures/cutting/` (copied from the published collection; see the README there), and the values listed beside them.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import type { PieceType } from "../../lib/planner/two-stage";

const DATA = path.resolve(import.meta.dirname, "..", "fixtures", "cutting", "GCUT", "original", "Original");

export function gcut(n: number) {
  const nums = readFileSync(path.join(DATA, `gcut${n}`), "utf8")
    .trim()
    .split(/\s+/)
    .map(Number);
  const m = nums[0];
  const sheet = { length: nums[1], width: nums[2] };
  const pieces: PieceType[] = [];
  for (let i = 0; i < m; i++) pieces.push({ length: nums[3 + 3 * i], width: nums[4 + 3 * i], value: nums[5 + 3 * i] });
  return { sheet, pieces };
}

// [instance, two-stage with trimming, strips along L; same, strips along W; unconstrained guillotine optimum]
export const TABLE: [number, number, number, number][] = [
  [1, 56460, 53808, 56460],
  [2, 60076, 60071, 60536],
  [3, 60133, 60078, 61036],
  [4, 61698, 61252, 61698],
  [5, 246000, 246000, 246000],
  [6, 235058, 238998, 238998],
  [7, 242567, 239405, 242567],
  [8, 245758, 244130, 246633],
  [9, 971100, 971100, 971100],
  [10, 982025, 955058, 982025],
  [11, 974638, 980096, 980096],
  [12, 977768, 978776, 979986],
  [13, 8906216, 8997780, 8997780], // gcut13: the optimum is from later literature, as listed beside the data
];
