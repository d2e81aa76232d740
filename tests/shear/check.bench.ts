/**
 * Benchmark: median time to check a 40-group program (target < 50 µs on the
 * project's build machine). A benchmark, not a timed test: it never fails.
 * Vitest's table shows no median, so each task prints its own median after its run.
 */
import { bench, describe } from "vitest";
import { checkProgram, findGrade, type CutGroup, type CutProgram, type GradeProfile } from "@/lib/shear";
import { DEMO_SHEAR } from "./fixtures";

const context = { shear: DEMO_SHEAR, grade: findGrade("A36") as GradeProfile };

/** Rip 300 mm strips, turn them, and cut each into blanks at 38 settings: 40 groups, no findings. */
function cleanProgram(): CutProgram {
  const cuts: CutGroup[] = [
    { backgauge: 300, count: 4 },
    { backgauge: 60, count: 1, turn: true },
  ];
  for (let i = 0; i < 38; i++) cuts.push({ backgauge: 60 + (i % 5) * 5, count: 1 });
  return {
    reference: "BENCH-40",
    grade: "A36",
    thickness: { value: 2 },
    units: "mm",
    sheet: { length: 3000, width: 1500, count: 10 },
    cuts,
  };
}

/** 30 narrow rips (each a warning), then the last strip turned and cut at 9 more settings. */
function warningProgram(): CutProgram {
  const cuts: CutGroup[] = [];
  for (let i = 0; i < 30; i++) cuts.push({ backgauge: 30 + (i % 5) * 5, count: 1 });
  cuts.push({ backgauge: 100, count: 5, turn: true });
  for (let i = 0; i < 9; i++) cuts.push({ backgauge: 100 + (i % 3) * 10, count: 1 });
  return {
    reference: "BENCH-40W",
    grade: "A36",
    thickness: { value: 2 },
    units: "mm",
    sheet: { length: 3000, width: 1500, count: 10 },
    cuts,
  };
}

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length === 0 ? Number.NaN : s[s.length >> 1];
};

/**
 * A bench task that also keeps its own timings (the teardown runs before
 * Vitest's result is filled in), drops the warm-up ones, and prints the median.
 */
function timedTask(label: string, program: CutProgram) {
  let samples: number[] = [];
  const fn = (): void => {
    const t0 = performance.now();
    checkProgram(program, context);
    samples.push(performance.now() - t0);
  };
  const teardown = (_task: unknown, mode?: "run" | "warmup"): void => {
    if (mode === "run")
      console.log(
        `median checkProgram, ${label}: ${(median(samples) * 1000).toFixed(1)} µs over ${samples.length} runs (target < 50 µs)`,
      );
    samples = [];
  };
  return { fn, options: { time: 2000, warmupTime: 500, teardown } };
}

describe("shear core", () => {
  const clean = timedTask("40 groups, no findings", cleanProgram());
  const warning = timedTask("40 groups, 30 warnings", warningProgram());
  bench("checkProgram, 40 groups, no findings", clean.fn, clean.options);
  bench("checkProgram, 40 groups, 30 warnings", warning.fn, warning.options);
});
