import { readFileSync } from "node:fs";

/** Linux reports thread CPU time in ticks of 1/100 s (USER_HZ, fixed at 100 for every architecture's /proc). */
const MS_PER_TICK = 10;

/**
 * CPU time (user + system) used so far by one thread of this process, ms, from `/proc/self/task/<tid>/stat`;
 * null when it cannot be read (not Linux, or the thread has ended). Resolution 10 ms.
 * @param tid the Linux thread id (a worker thread reads its own from `/proc/thread-self`)
 */
export function threadCpuMs(tid: number | null): number | null {
  if (tid === null) return null;
  try {
    const stat = readFileSync(`/proc/self/task/${tid}/stat`, "utf8");
    // Fields after the command name, which is in parentheses and may hold spaces: state is field 3, utime 14, stime 15.
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    const ticks = Number(fields[11]) + Number(fields[12]);
    return Number.isFinite(ticks) ? ticks * MS_PER_TICK : null;
  } catch {
    return null;
  }
}
