/**
 * The shear core: checks a cut program against a shear and a grade, works out
 * the setup, the piece flow (yield) and the cycle estimate.
 *
 * Pure: no I/O, no clock, no framework. Never throws on any input; problems
 * come back as findings. Never changes the program.
 *
 * This file is the public surface only: reading a program lives in `read.ts`,
 * cleaning the shear and grade in `context.ts`, the check itself in `check.ts`.
 */
export * from "./types";
export * from "./reports";
export * from "./units";
export * from "./gauges";
export * from "./grades";
export * from "./force";
export * from "./setup";
export * from "./gap";
export * from "./flow";
export * from "./yields";
export * from "./place";
export * from "./layout";
export * from "./findings";
export * from "./groups";
export * from "./estimate";
export { checkProgram, recommendSetup } from "./check";
