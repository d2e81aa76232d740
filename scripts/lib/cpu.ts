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

/** CPU milliseconds so far, read from /proc once: the machine's, and the processes' the benchmarks watch. */
export interface CpuSnapshot {
  machine: number;
  /** by process group leader (a daemon leads its own group, so its children count too) */
  groups: Map<number, number>;
  postgres: number;
  redis: number;
}

export function cpuSnapshot(): CpuSnapshot {
  const groups = new Map<number, number>();
  let postgres = 0;
  let redis = 0;
  for (const { command, pgid, cpuMs } of processes()) {
    groups.set(pgid, (groups.get(pgid) ?? 0) + cpuMs);
    if (command.startsWith("postgres")) postgres += cpuMs;
    if (command.startsWith("redis-server")) redis += cpuMs;
  }
  return { machine: machineCpuMs(), groups, postgres, redis };
}

/** CPU milliseconds the machine spent busy (user, nice, system, irq, softirq; not idle, iowait or steal). */
function machineCpuMs(): number {
  const line = readFileSync("/proc/stat", "utf8").split("\n")[0];
  const [user, nice, system, , , irq, softirq] = line.trim().split(/\s+/).slice(1).map(Number);
  return ((user + nice + system + irq + softirq) * 1000) / TICKS_PER_SECOND;
}
