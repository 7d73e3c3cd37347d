import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { performance } from "node:perf_hooks";

const TICKS_PER_S = 100; // Linux USER_HZ (common practice)

/** CPU seconds used so far by a PostgreSQL cluster: its postmaster and every live child (Linux /proc). */
function postgresCpuS(dataDir: string): number {
  const postmaster = Number(readFileSync(join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);
  let ticks = 0;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      // Fields after the parenthesised name: state ppid … utime(14) stime(15), counted from 1.
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      const pid = Number(entry);
      const ppid = Number(fields[1]);
      if (pid === postmaster || ppid === postmaster) ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      /* the process ended meanwhile */
    }
  }
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

/** Starts measuring; call the returned function to read what was used since. */
export function startCpuMeter(postgresDataDir: string): () => CpuReading {
  const elu = performance.eventLoopUtilization();
  const cpu = process.cpuUsage();
  const pg = postgresCpuS(postgresDataDir);
  return () => {
    const used = process.cpuUsage(cpu);
    return {
      mainLoopBusy: performance.eventLoopUtilization(elu).utilization,
      processCpuS: (used.user + used.system) / 1e6,
      postgresCpuS: postgresCpuS(postgresDataDir) - pg,
    };
  };
}
