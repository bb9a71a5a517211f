import { readFileSync } from 'node:fs';

const CLOCK_TICKS_PER_SECOND = 100;

/** CPU seconds (user + system, all threads) a process has used so far, from /proc/<pid>/stat; null if unknown. */
export function processCpuSeconds(pid: number | null | undefined): number | null {
  if (!pid) return null;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // Fields after the parenthesised command name; utime and stime are fields 14 and 15 (1-based).
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / CLOCK_TICKS_PER_SECOND;
  } catch {
    return null;
  }
}

/** The 1, 5 and 15 minute load averages, as the kernel prints them. */
export function loadAverage(): string {
  try {
    return readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
  } catch {
    return 'n/a';
  }
}
