/**
 * Memory of another process from Linux's /proc/<pid>/status: VmRSS (resident
 * set now) and VmHWM (its high-water mark). Writing 5 to /proc/<pid>/clear_refs
 * resets the high-water mark to the present RSS (proc(5)), so the peak of one
 * operation can be read apart from the process's start-up and earlier work.
 * A poller beside it keeps the largest VmRSS seen, a check that does not rely
 * on the reset being allowed.
 */
import { readFileSync, writeFileSync } from 'node:fs';

export interface ProcessMemory {
  rssMB: number;
  peakMB: number;
}

/** /proc counts in kB of 1024 bytes; the figures are in MB of 10^6 bytes, as the target is written. */
const MB_PER_KB = 1024 / 1e6;

export function readProcessMemory(pid: number): ProcessMemory {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (key: string) => {
    const match = status.match(new RegExp(`^${key}:\\s+(\\d+)\\s+kB`, 'm'));
    if (!match) throw new Error(`/proc/${pid}/status has no ${key}`);
    return Number(match[1]);
  };
  return { rssMB: kb('VmRSS') * MB_PER_KB, peakMB: kb('VmHWM') * MB_PER_KB };
}

/** Resets VmHWM of the process to its present RSS; false when the kernel does not allow it. */
export function resetPeakMemory(pid: number): boolean {
  try {
    writeFileSync(`/proc/${pid}/clear_refs`, '5');
    return true;
  } catch {
    return false;
  }
}

export interface PeakWatch {
  /** Stops polling; the peak by VmHWM (after the reset) and the largest VmRSS polled. */
  stop: () => { peakMB: number; polledPeakMB: number; hwmWasReset: boolean };
}

/** Resets the high-water mark and polls VmRSS every `everyMs` until stop(). */
export function watchPeakMemory(pid: number, everyMs = 20): PeakWatch {
  const hwmWasReset = resetPeakMemory(pid);
  let polledPeakMB = readProcessMemory(pid).rssMB;
  const timer = setInterval(() => {
    polledPeakMB = Math.max(polledPeakMB, readProcessMemory(pid).rssMB);
  }, everyMs);
  return {
    stop() {
      clearInterval(timer);
      const now = readProcessMemory(pid);
      polledPeakMB = Math.max(polledPeakMB, now.rssMB);
      return { peakMB: hwmWasReset ? now.peakMB : polledPeakMB, polledPeakMB, hwmWasReset };
    },
  };
}
