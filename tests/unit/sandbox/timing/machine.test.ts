import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { machineFingerprint } from '@sandbox/timing/machine.ts';

describe('machineFingerprint', () => {
  it('describes this process and the installed isolated-vm', () => {
    const fp = machineFingerprint();
    const installed = JSON.parse(
      readFileSync(
        new URL('../../../../node_modules/isolated-vm/package.json', import.meta.url),
        'utf8',
      ),
    ) as { version: string };
    expect(fp.isolatedVmVersion).toBe(installed.version);
    expect(fp.nodeVersion).toBe(process.versions.node);
    expect(fp.v8Version).toBe(process.versions.v8);
    expect(fp.platform).toBe(`${process.platform}-${process.arch}`);
    expect(fp.cores).toBeGreaterThan(0);
    expect(fp.totalMemoryBytes).toBeGreaterThan(0);
    expect(fp.cpuModel.length).toBeGreaterThan(0);
  });
});
