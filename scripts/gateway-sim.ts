/**
 * A reference machine-side gateway, for trying the hub without a shear: it long-polls for
 * the next released program of one shear, claims it, "runs" it group by group with the
 * shear core's cycle estimate (sped up by --speed), keeps the lease with heartbeats,
 * reports progress and completion. Stopped and started again, it picks up the program it
 * was running (its state is kept in a small file) if its lease has not run out.
 *   npm run gateway:sim -- --shear shr_… [--key swk_…] [--url http://127.0.0.1:3000] [--speed 20] [--once]
 */
import { existsSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";

const { values } = parseArgs({
  options: {
    shear: { type: "string" },
    key: { type: "string" },
    url: { type: "string" },
    speed: { type: "string" },
    once: { type: "boolean" },
    state: { type: "string" },
    lease: { type: "string" },
  },
});
const shear = values.shear;
const key = values.key ?? process.env.SHEARWIRE_GATEWAY_KEY;
if (!shear || !key) {
  console.error(
    "usage: npm run gateway:sim -- --shear shr_… --key swk_… (or SHEARWIRE_GATEWAY_KEY) [--speed 20] [--once]",
  );
  process.exit(2);
}
const base = (values.url ?? process.env.SHEARWIRE_BASE_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const speed = Math.max(0.01, Number(values.speed ?? 20));
const leaseSeconds = Number(values.lease ?? 60);
const stateFile = values.state ?? path.join(os.tmpdir(), `shearwire-gateway-${shear}.json`);

interface State {
  programId: string;
  step: number;
  strokesDone: number;
}
const log = (msg: string) => console.log(`[gateway ${shear}] ${new Date().toISOString()} ${msg}`);
let stopping = false;
for (const sig of ["SIGINT", "SIGTERM"] as const) {
  process.once(sig, () => {
    stopping = true;
    log(`${sig}: stopping; the state stays in ${stateFile} for the next start`);
    setTimeout(() => process.exit(0), 200).unref();
  });
}

/** What this simulator reads of the API's answers. */
interface SimProgram {
  id: string;
  status: string;
  reference: string;
  sheet: { count: number };
  check?: {
    yield?: { groups?: { strokes: number }[]; sheets?: number; total?: { blanks?: number } };
    estimate?: { seconds?: { total?: number } };
  };
}
interface Answer {
  detail?: string;
  program: SimProgram;
  lease: { expiresAt: string };
}

async function call(method: string, url: string, body?: unknown): Promise<{ status: number; json: Answer }> {
  const res = await fetch(`${base}/api/v1${url}`, {
    method,
    headers: { authorization: `Bearer ${key}`, "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, json: text ? JSON.parse(text) : null };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const save = (s: State) => writeFileSync(stateFile, JSON.stringify(s));

/** Wait `ms`, sending heartbeats often enough to keep the lease. */
async function work(programId: string, ms: number) {
  const beat = (leaseSeconds * 1000) / 3;
  let left = ms;
  while (left > 0 && !stopping) {
    const step = Math.min(left, beat);
    await sleep(step);
    left -= step;
    if (left > 0) {
      const hb = await call("POST", `/programs/${programId}/heartbeat`, { leaseSeconds });
      if (hb.status !== 200) throw new Error(`lost the program: ${hb.json?.detail ?? hb.status}`);
    }
  }
}

async function run(program: SimProgram, state: State) {
  const groups: { strokes: number }[] = program.check?.yield?.groups ?? [];
  const sheets: number = program.check?.yield?.sheets ?? program.sheet.count;
  const steps = Math.max(1, groups.length * sheets);
  const totalMs = ((program.check?.estimate?.seconds?.total ?? 60) * 1000) / speed;
  if (program.status === "claimed") {
    const started = await call("POST", `/programs/${program.id}/start`);
    if (started.status !== 200) throw new Error(`could not start: ${started.json?.detail}`);
    log(
      `started ${program.id} (${program.reference}): ${steps} groups over ${sheets} sheet(s), about ${(totalMs / 1000).toFixed(1)} s at ×${speed}`,
    );
  } else {
    log(`resuming ${program.id} at group ${state.step + 1} of ${steps}`);
  }
  while (state.step < steps && !stopping) {
    await work(program.id, totalMs / steps);
    if (stopping) return;
    state.strokesDone += groups.length ? groups[state.step % groups.length].strokes : 1;
    state.step += 1;
    const progress = await call("POST", `/programs/${program.id}/progress`, {
      groupsDone: state.step,
      strokesDone: state.strokesDone,
      leaseSeconds,
    });
    if (progress.status !== 200) throw new Error(`progress refused: ${progress.json?.detail ?? progress.status}`);
    save(state);
  }
  if (stopping) return;
  const blanks = program.check?.yield?.total?.blanks ?? 0;
  const done = await call("POST", `/programs/${program.id}/complete`, {
    goodPieces: blanks,
    scrappedPieces: 0,
    sheetsUsed: sheets,
    notes: "simulated run",
  });
  if (done.status !== 200) throw new Error(`completion refused: ${done.json?.detail ?? done.status}`);
  log(`completed ${program.id}: ${blanks} good pieces`);
  rmSync(stateFile, { force: true });
}

async function resume(): Promise<boolean> {
  if (!existsSync(stateFile)) return false;
  const state: State = JSON.parse(readFileSync(stateFile, "utf8"));
  const hb = await call("POST", `/programs/${state.programId}/heartbeat`, { leaseSeconds });
  if (hb.status !== 200) {
    log(`the program I was running (${state.programId}) is no longer mine: ${hb.json?.detail ?? hb.status}`);
    rmSync(stateFile, { force: true });
    return false;
  }
  await run(hb.json.program, state);
  return true;
}

log(`polling ${base} (speed ×${speed})`);
try {
  const resumed = await resume();
  if (!(resumed && values.once)) {
    while (!stopping) {
      const claim = await call("POST", `/shears/${shear}/claims`, { waitSeconds: 30, leaseSeconds });
      if (claim.status === 204) continue;
      if (claim.status !== 200) throw new Error(`claim refused: ${claim.json?.detail ?? claim.status}`);
      const state: State = { programId: claim.json.program.id, step: 0, strokesDone: 0 };
      save(state);
      log(`claimed ${state.programId}, lease until ${claim.json.lease.expiresAt}`);
      await run(claim.json.program, state);
      if (values.once) break;
    }
  }
} catch (err) {
  log(`stopped: ${(err as Error).message}`);
  process.exitCode = 1;
}
