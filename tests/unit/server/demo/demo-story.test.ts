import { describe, expect, it } from 'vitest';
import { typeCheckKernel } from '@sandbox/isolate/type-check.ts';
import { momentTime } from '@server/demo/demo-clock.ts';
import { lineContaining } from '@server/demo/demo-events.ts';
import { demoKernelSource, type KernelRef } from '@server/demo/demo-kernels.ts';
import { demoRoutines, type DemoRoutineKey } from '@server/demo/demo-routines.ts';
import { demoStory, setupMoments } from '@server/demo/demo-story.ts';
import { demoTeam } from '@server/demo/demo-team.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';

const anchor = new Date('2026-06-15T12:00:00Z');
const roles = new Map<string, string>([
  [demoTeam.maintainer, 'maintainer'],
  ...demoTeam.members.map((m) => [m.login, m.role] as const),
]);

describe('the demo story', () => {
  it('is told in order, after the set-up', () => {
    const times = [
      ...Object.values(setupMoments).map((m) => momentTime(anchor, m).getTime()),
      ...demoStory.map((e) => momentTime(anchor, e).getTime()),
    ];
    for (let i = 1; i < times.length; i++) expect(times[i]).toBeGreaterThanOrEqual(times[i - 1]!);
    expect(times[times.length - 1]).toBeLessThan(anchor.getTime());
  });

  it('has five people, all of them demo identities, holding every role', () => {
    const logins = new Set(demoIdentities.map((i) => i.login));
    expect(roles.size).toBe(5);
    for (const login of roles.keys()) expect(logins.has(login)).toBe(true);
    expect(new Set(roles.values())).toEqual(new Set(['author', 'reviewer', 'maintainer']));
  });

  it('lets each event be done by someone allowed to, on a candidate that exists by then', () => {
    const authors = new Map<string, string>();
    const kernels = new Map<string, KernelRef>();
    const routineOf = new Map<string, DemoRoutineKey>();
    for (const event of demoStory) {
      if ('by' in event) expect(roles.has(event.by)).toBe(true);
      if (event.kind === 'submit' || event.kind === 'draft') {
        expect(authors.has(event.candidate)).toBe(false);
        authors.set(event.candidate, event.by);
        routineOf.set(event.candidate, event.routine);
        if (event.kind === 'submit') kernels.set(event.candidate, event.kernel);
        continue;
      }
      if (event.kind === 'drift-check') continue;
      expect(authors.has(event.candidate)).toBe(true);
      if (event.kind === 'revise') {
        expect(event.by).toBe(authors.get(event.candidate));
        kernels.set(event.candidate, event.kernel);
      }
      if (event.kind === 'review') {
        expect(event.by).not.toBe(authors.get(event.candidate));
        expect(roles.get(event.by)).not.toBe('author');
      }
      if (event.kind === 'promote' || event.kind === 'reinstate') {
        expect(roles.get(event.by)).toBe('maintainer');
      }
      if (event.kind === 'reinstate') expect(routineOf.get(event.candidate)).toBe(event.routine);
      if (event.kind === 'comment' && event.line !== undefined) {
        const source = demoKernelSource(kernels.get(event.candidate)!);
        expect(lineContaining(source, event.line)).toBeGreaterThan(0);
      }
    }
  });

  it('submits kernels that meet their contract, except the one meant to fail its type check', () => {
    const contracts = new Map(demoRoutines.map((r) => [r.key, r.contract]));
    const failing: string[] = [];
    for (const event of demoStory) {
      if (event.kind !== 'submit') continue;
      const source = demoKernelSource(event.kernel);
      const { diagnostics } = typeCheckKernel(source, contracts.get(event.routine)!);
      if (diagnostics.length > 0) failing.push(event.candidate);
    }
    expect(failing).toEqual(['lu-blocked']);
  });
});
