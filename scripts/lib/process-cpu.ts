import { readdirSync, readFileSync } from "node:fs";

/** CPU seconds used so far by every process in a process group (Linux /proc), to report CPU per request. */
export function groupCpuSeconds(groupId: number): number {
  const ticksPerSecond = 100;
  let ticks = 0;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      // After the command name: state, ppid, pgrp, …; utime and stime are fields 14 and 15 of the full line.
      if (Number(fields[2]) === groupId) ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      // the process ended while we looked
    }
  }
  return ticks / ticksPerSecond;
}


/** CPU seconds used so far by every process whose command name is `command` (e.g. "postgres"). */
export function commandCpuSeconds(command: string): number {
  let ticks = 0;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      if (stat.slice(stat.indexOf("(") + 1, stat.lastIndexOf(")")) !== command) continue;
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      // the process ended while we looked
    }
  }
  return ticks / 100;
}

/** Busy and total CPU ticks of the whole machine so far (Linux /proc/stat), for a busy share over an interval. */
export function machineTicks(): { busy: number; total: number } {
  const fields = readFileSync("/proc/stat", "utf8").split("\n")[0].trim().split(/\s+/).slice(1).map(Number);
  const total = fields.reduce((sum, value) => sum + value, 0);
  const idle = fields[3] + (fields[4] ?? 0);
  return { busy: total - idle, total };
}
