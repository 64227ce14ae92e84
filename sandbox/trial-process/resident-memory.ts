import { readFileSync } from 'node:fs';

/**
 * The resident set of process `pid` in MB, from Linux's /proc/<pid>/status (VmRSS, in kB), or
 * null where that cannot be read (another system, or the process has gone).
 */
export function readResidentMb(pid: number): number | null {
  try {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    const match = /^VmRSS:\s+(\d+)\s+kB$/m.exec(status);
    return match ? Number(match[1]) / 1024 : null;
  } catch {
    return null;
  }
}
