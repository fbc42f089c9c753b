/**
 * Where a run's time went, per thread, for `upright check --timing`: how many files each thread
 * checked, how long it was busy with them, and the CPU time it used. CPU time next to wall time shows
 * whether threads were working or waiting for a core (on a loaded machine, busy ≫ CPU).
 */
import {readFileSync} from 'node:fs'

export interface ThreadTiming {
  /** Worker thread id; 0 is the main thread. */
  thread: number
  files: number
  diagrams: number
  /** Wall milliseconds spent checking files (worker start-up excluded). */
  busyMs: number
  /** CPU seconds (user + system) the thread used since it started; undefined where unknown. */
  cpuSeconds: number | undefined
}

/**
 * CPU seconds of the calling thread, from /proc/thread-self/stat (Linux): fields 14 and 15, user and
 * system time in clock ticks of 1/100 s (USER_HZ, which the kernel fixes at 100 for user space on the
 * common architectures — a recalled value, see proc(5)). Undefined on systems without it.
 */
export function threadCpuSeconds(): number | undefined {
  let stat: string
  try {
    stat = readFileSync('/proc/thread-self/stat', 'utf8')
  } catch {
    return undefined
  }
  // The command name (field 2) is in parentheses and may hold spaces: count fields after it.
  const rest = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
  const user = Number(rest[11])
  const system = Number(rest[12])
  return Number.isFinite(user) && Number.isFinite(system) ? (user + system) / 100 : undefined
}
