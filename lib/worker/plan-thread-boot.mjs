// The planning thread's entry: the worker runs TypeScript through tsx, and a new thread starts
// without tsx's loader, so it registers it first, then loads the thread's own module.
import { register } from "tsx/esm/api";

register();
await import("./plan-thread.ts");
