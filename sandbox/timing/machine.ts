import { createRequire } from 'node:module';
import os from 'node:os';

/**
 * A fingerprint of the machine and runtime that produced a timing: what a reader needs to know
 * before comparing timings across runs (CPU model, runtime and library versions; numerics-references
 * §10 shows wrong results that depended on exactly these). The only module of the engine that uses
 * Node APIs, so it is kept apart from the pure timing statistics.
 */

export interface MachineFingerprint {
  cpuModel: string;
  /** Logical processors, as os.cpus() reports them. */
  cores: number;
  totalMemoryBytes: number;
  /** `${process.platform}-${process.arch}`, e.g. linux-x64. */
  platform: string;
  nodeVersion: string;
  v8Version: string;
  isolatedVmVersion: string;
}

/** Read the version of the installed isolated-vm package ('unknown' when it cannot be read). */
function isolatedVmVersion(): string {
  try {
    const pkg = createRequire(import.meta.url)('isolated-vm/package.json') as { version?: unknown };
    return typeof pkg.version === 'string' ? pkg.version : 'unknown';
  } catch {
    return 'unknown';
  }
}

/** The fingerprint of the current process's machine and runtime. Cost: a few system calls. */
export function machineFingerprint(): MachineFingerprint {
  const cpus = os.cpus();
  return {
    cpuModel: cpus[0]?.model.trim() ?? 'unknown',
    cores: cpus.length,
    totalMemoryBytes: os.totalmem(),
    platform: `${process.platform}-${process.arch}`,
    nodeVersion: process.versions.node,
    v8Version: process.versions.v8,
    isolatedVmVersion: isolatedVmVersion(),
  };
}
