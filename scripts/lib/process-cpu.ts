import { readdirSync, readFileSync } from "node:fs";

const TICKS_PER_SECOND = 100;

/** CPU seconds so far of every process whose /proc stat line passes `matches` (name, then the fields after it). */
function processCpuSeconds(matches: (command: string, fields: string[]) => boolean): number {
  let ticks = 0;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const command = stat.slice(stat.indexOf("(") + 1, stat.lastIndexOf(")"));
      // After the command name: state, ppid, pgrp, …; utime and stime are the 12th and 13th of these.
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      if (matches(command, fields)) ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      // the process ended while we looked
    }
  }
  return ticks / TICKS_PER_SECOND;
}

/** CPU seconds used so far by every process in a process group, to report CPU per request. */
export function groupCpuSeconds(groupId: number): number {
  return processCpuSeconds((_command, fields) => Number(fields[2]) === groupId);
}

/** CPU seconds used so far by every process whose command name is `command` (e.g. "postgres"). */
export function commandCpuSeconds(command: string): number {
  return processCpuSeconds((name) => name === command);
}

/** Busy and total CPU ticks of the whole machine so far (Linux /proc/stat), for a busy share over an interval. */
export function machineTicks(): { busy: number; total: number } {
  const fields = readFileSync("/proc/stat", "utf8").split("\n")[0].trim().split(/\s+/).slice(1).map(Number);
  const total = fields.reduce((sum, value) => sum + value, 0);
  const idle = fields[3] + (fields[4] ?? 0);
  return { busy: total - idle, total };
}
