import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { performance } from "node:perf_hooks";

const TICKS_PER_S = 100; // Linux USER_HZ (common practice)

/** CPU ticks used so far by each process of a PostgreSQL cluster: its postmaster and every live child (Linux /proc). */
function postgresTicks(dataDir: string): Map<number, number> {
  const postmaster = Number(readFileSync(join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);
  const ticks = new Map<number, number>();
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      // Fields after the parenthesised name: state ppid … utime(14) stime(15), counted from 1.
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      const pid = Number(entry);
      const ppid = Number(fields[1]);
      if (pid === postmaster || ppid === postmaster) ticks.set(pid, Number(fields[11]) + Number(fields[12]));
    } catch {
      /* the process ended meanwhile */
    }
  }
  return ticks;
}

/**
 * CPU seconds the cluster used since `before`: what each process alive now added (all of it for
 * a process started since). A process that ended meanwhile is left out, so this can only
 * undercount; connections of the pools under test live for the whole run.
 */
function postgresCpuSince(dataDir: string, before: Map<number, number>): number {
  let ticks = 0;
  for (const [pid, now] of postgresTicks(dataDir)) ticks += now - (before.get(pid) ?? 0);
  return ticks / TICKS_PER_S;
}

export interface CpuReading {
  /** Share of wall time the main thread's event loop was busy (0–1). */
  mainLoopBusy: number;
  /** CPU seconds of this whole process, every thread. */
  processCpuS: number;
  /** CPU seconds of the PostgreSQL cluster. */
  postgresCpuS: number;
}

/** Readings of several spans as one: CPU seconds added, busy share weighted by each span's length. */
export function combineReadings(spans: { reading: CpuReading; durationS: number }[]): CpuReading {
  const total = spans.reduce((s, x) => s + x.durationS, 0);
  return {
    mainLoopBusy: spans.reduce((s, x) => s + x.reading.mainLoopBusy * x.durationS, 0) / total,
    processCpuS: spans.reduce((s, x) => s + x.reading.processCpuS, 0),
    postgresCpuS: spans.reduce((s, x) => s + x.reading.postgresCpuS, 0),
  };
}

/** Starts measuring; call the returned function to read what was used since. */
export function startCpuMeter(postgresDataDir: string): () => CpuReading {
  const elu = performance.eventLoopUtilization();
  const cpu = process.cpuUsage();
  const pg = postgresTicks(postgresDataDir);
  return () => {
    const used = process.cpuUsage(cpu);
    return {
      mainLoopBusy: performance.eventLoopUtilization(elu).utilization,
      processCpuS: (used.user + used.system) / 1e6,
      postgresCpuS: postgresCpuSince(postgresDataDir, pg),
    };
  };
}
