import { readdirSync, readFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';

let clockTicksPerSecond: number | undefined;
/** The clock ticks per second of /proc's CPU times (USER_HZ), as `getconf CLK_TCK` reports it. */
function userHz(): number {
  clockTicksPerSecond ??= Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim());
  if (!(clockTicksPerSecond > 0)) throw new Error('getconf CLK_TCK gave no tick rate');
  return clockTicksPerSecond;
}

/** Percentile of a sample by the nearest-rank method (sorted copy). */
export function percentile(values: number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[rank];
}

export function median(values: number[]): number {
  return percentile(values, 50);
}

/** Runs fn repeatedly and returns the median wall time in milliseconds. */
export async function medianMs(fn: () => unknown | Promise<unknown>, repeats = 15): Promise<number> {
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    await fn();
    times.push(performance.now() - start);
  }
  return round(median(times));
}

export function round(value: number, digits = 2): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

/** Runs `count` jobs with at most `concurrency` in flight; each job is told its lane (0…concurrency−1). */
export async function runPool(count: number, concurrency: number, job: (i: number, lane: number) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(Array.from({ length: concurrency }, async (_, lane) => {
    for (;;) {
      const i = next++;
      if (i >= count) return;
      await job(i, lane);
    }
  }));
}

/**
 * The whole machine's busy CPU time so far, in milliseconds (Linux /proc/stat: user, nice, system,
 * irq, softirq and steal of every core). Read before and after a phase, it gives the CPU that phase
 * cost all processes together (app, MariaDB, the benchmark's own clients): steadier than a rate
 * when the machine is shared.
 */
export function machineBusyCpuMs(): number {
  const [cpu] = readFileSync('/proc/stat', 'utf8').split('\n');
  const [, user, nice, system, , , irq, softirq, steal] = cpu.trim().split(/\s+/).map(Number);
  return ((user + nice + system + irq + softirq + steal) / userHz()) * 1000;
}

/**
 * In-control values around the bench nominal (100 ± 6, a sum of three uniforms as the data set's),
 * seeded. Every benchmark that posts or stores runs uses them, so the stored series stay what a
 * line in control produces: a constant value would shrink the moving ranges that later control
 * limits are computed from, and the SPC rules would then fire on ordinary data.
 */
export function inControlValues(seed: number) {
  let s = seed >>> 0;
  const uniform = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
  return () => Math.round((100 + (uniform() + uniform() + uniform() - 1.5) * 4) * 1000) / 1000;
}

/**
 * Waits (up to `limitMs`) until the machine has been nearly idle for a second: MariaDB flushes
 * and purges for a while after a section that wrote a lot, and a section measured meanwhile
 * would pay for the one before it. Returns how long it waited.
 */
export async function waitForQuietMachine(limitMs = 90_000, busyShare = 0.15, cores = 2): Promise<number> {
  const start = performance.now();
  for (;;) {
    const cpuStart = machineBusyCpuMs();
    const wallStart = performance.now();
    await new Promise((resolve) => setTimeout(resolve, 1000));
    const busy = (machineBusyCpuMs() - cpuStart) / ((performance.now() - wallStart) * cores);
    if (busy < busyShare || performance.now() - start > limitMs) return Math.round(performance.now() - start);
  }
}

/** utime + stime (ms) and the parent of one process; null once it has gone. */
function processStat(pid: number): { cpuMs: number; parent: number } | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // Fields 4, 14 and 15 of proc(5): ppid, utime and stime, the times in USER_HZ ticks.
    return { parent: Number(fields[1]), cpuMs: ((Number(fields[11]) + Number(fields[12])) / userHz()) * 1000 };
  } catch {
    return null;
  }
}

function commandLineOf(pid: number): string {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').replaceAll('\0', ' ');
  } catch {
    return '';
  }
}

/**
 * CPU time so far of the processes a section's figures are made of: the bench's MariaDB, the
 * app's processes this benchmark started (its descendants running server/index.ts) and this
 * benchmark process. Read before and after a phase, it shows where the machine's CPU went (the
 * rest of machineBusyCpuMs is the kernel and other processes).
 */
export function cpuByProcessMs(): { mariadb: number; app: number; bench: number } {
  const stats = new Map<number, { cpuMs: number; parent: number }>();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    const stat = processStat(Number(name));
    if (stat) stats.set(Number(name), stat);
  }
  const descendsFromBench = (pid: number): boolean => {
    for (let p = stats.get(pid)?.parent; p !== undefined && p > 1; p = stats.get(p)?.parent) if (p === process.pid) return true;
    return false;
  };
  const totals = { mariadb: 0, app: 0, bench: stats.get(process.pid)?.cpuMs ?? 0 };
  for (const [pid, stat] of stats) {
    const command = commandLineOf(pid);
    if (command.includes('mariadbd') && command.includes('bench-mariadb')) totals.mariadb += stat.cpuMs;
    else if (command.includes('server/index.ts') && descendsFromBench(pid)) totals.app += stat.cpuMs;
  }
  return totals;
}
