/**
 * CPU time, read from Linux's /proc, for the benchmarks: a process group's (a daemon leads its
 * own group, so its children count too) and the whole machine's. Throughput on a shared machine
 * moves with its neighbours; the CPU a request costs moves much less, so the benchmarks print both.
 */
import { readdirSync, readFileSync } from "node:fs";

/** clock ticks per second of /proc's counters (USER_HZ, 100 on Linux) */
const TICKS_PER_SECOND = 100;

interface ProcessCpu {
  command: string;
  pgid: number;
  /** user + system, milliseconds */
  cpuMs: number;
}

/** Every live process's CPU so far. */
function processes(): ProcessCpu[] {
  const found: ProcessCpu[] = [];
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    let stat: string;
    try {
      stat = readFileSync(`/proc/${entry}/stat`, "utf8");
    } catch {
      continue; // ended while we looked
    }
    // the command name may hold spaces and parentheses: the fields after the last ")" are fixed
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    // fields[0] is the state (field 3 of stat(5)); pgrp is field 5, utime 14, stime 15
    found.push({
      command: stat.slice(stat.indexOf("(") + 1, stat.lastIndexOf(")")),
      pgid: Number(fields[2]),
      cpuMs: ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS_PER_SECOND,
    });
  }
  return found;
}

/** user + system CPU milliseconds of every live process in the group `pgid`. */
export function groupCpuMs(pgid: number): number {
  return processes()
    .filter((p) => p.pgid === pgid)
    .reduce((sum, p) => sum + p.cpuMs, 0);
}

/** user + system CPU milliseconds of the live processes whose command name starts with `prefix` (e.g. "postgres"). */
export function commandCpuMs(prefix: string): number {
  return processes()
    .filter((p) => p.command.startsWith(prefix))
    .reduce((sum, p) => sum + p.cpuMs, 0);
}

/** CPU milliseconds the machine spent busy (user, nice, system, irq, softirq; not idle, iowait or steal). */
export function machineCpuMs(): number {
  const line = readFileSync("/proc/stat", "utf8").split("\n")[0];
  const [user, nice, system, , , irq, softirq] = line.trim().split(/\s+/).slice(1).map(Number);
  return ((user + nice + system + irq + softirq) * 1000) / TICKS_PER_SECOND;
}
