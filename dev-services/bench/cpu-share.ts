import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

/**
 * Who used the machine's cores during a run, read from Linux's /proc (proc(5)): each process's user
 * and system time (fields 14 and 15 of /proc/<pid>/stat, in clock ticks) and the machine's busy time
 * (/proc/stat's first line). A throughput ceiling means little without it: with the server, its
 * database and the load generator on the same two cores, the cores are shared three ways.
 */
// Clock ticks per second: USER_HZ, 100 on every Linux this runs on (sysconf(_SC_CLK_TCK)).
const TICKS_PER_SECOND = 100;

interface ProcessTime {
  parent: number;
  ticks: number;
}

export interface CpuSample {
  at: number;
  processes: Map<number, ProcessTime>;
  machineBusyTicks: number;
}

function readProcess(pid: number): ProcessTime | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    // The command name, in parentheses, may itself hold spaces: the fields start after its last ")".
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    return { parent: Number(fields[1]), ticks: Number(fields[11]) + Number(fields[12]) };
  } catch {
    return null; // it ended meanwhile
  }
}

export function sampleCpu(): CpuSample {
  const processes = new Map<number, ProcessTime>();
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    const time = readProcess(Number(entry));
    if (time) processes.set(Number(entry), time);
  }
  const [, ...counts] = readFileSync("/proc/stat", "utf8").split("\n")[0]!.trim().split(/\s+/).map(Number);
  // user nice system idle iowait irq softirq steal: busy is everything but idle and iowait.
  const busy = counts.slice(0, 8).reduce((sum, n, i) => (i === 3 || i === 4 ? sum : sum + n), 0);
  return { at: performance.now(), processes, machineBusyTicks: busy };
}

/** `root` and every process below it. */
function treeOf(sample: CpuSample, root: number): Set<number> {
  const tree = new Set([root]);
  let grew = true;
  while (grew) {
    grew = false;
    for (const [pid, { parent }] of sample.processes) {
      if (!tree.has(pid) && tree.has(parent)) {
        tree.add(pid);
        grew = true;
      }
    }
  }
  return tree;
}

/** The postmaster's pid, from the first line of the cluster's postmaster.pid. */
export const postmasterOf = (dataDir: string) => Number(readFileSync(path.join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);

/**
 * Cores each group of processes kept busy between two samples (a group is a root process and all
 * below it, counted once, in the order given), and the machine's whole busy share.
 */
export function coresUsed(before: CpuSample, after: CpuSample, groups: Record<string, number>): Record<string, number> & { machine: number } {
  const seconds = (after.at - before.at) / 1000;
  const cores = (ticks: number) => Math.round((ticks / TICKS_PER_SECOND / seconds) * 100) / 100;
  const counted = new Set<number>();
  const used: Record<string, number> = {};
  for (const [name, root] of Object.entries(groups)) {
    let ticks = 0;
    for (const pid of treeOf(after, root)) {
      if (counted.has(pid)) continue;
      counted.add(pid);
      ticks += (after.processes.get(pid)?.ticks ?? 0) - (before.processes.get(pid)?.ticks ?? 0);
    }
    used[name] = cores(ticks);
  }
  return { ...used, machine: cores(after.machineBusyTicks - before.machineBusyTicks) };
}
