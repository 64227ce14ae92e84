import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { submissionSchema } from '@shared/api/candidates.ts';
import {
  trialDetailSchema,
  trialEventSchema,
  trialPageSchema,
  type TrialEvent,
} from '@shared/api/trials.ts';
import { parseWithNonFinite } from '@shared/json-numbers.ts';
import { loadEnv } from '@server/config/env.ts';
import { trialMatrixResults } from '@server/db/schema/trial-results.ts';
import { trials } from '@server/db/schema/trials.ts';
import {
  call,
  goodKernel,
  startReviewWorld,
  type ReviewWorld,
} from '@tests/integration/server/candidates/review-world.ts';
import { seedCandidate } from '@tests/integration/server/candidates/seed-candidates.ts';
import {
  finishTrial,
  writeProgress,
} from '@tests/integration/server/candidates/simulated-worker.ts';

let world: ReviewWorld;
beforeAll(async () => {
  world = await startReviewWorld(inject('databaseUrl'));
});
afterAll(() => world.close());

async function submitted() {
  const res = await call(
    world.api(`/routines/${world.routine.id}/candidates`),
    world.people.author,
    'POST',
    {
      title: 'Streamed LU',
      source: goodKernel,
    },
  );
  return submissionSchema.parse(res.body);
}

describe('the trial report', () => {
  it('carries the full results, with non-finite numbers as strings', async () => {
    const { trial } = await submitted();
    await finishTrial(world.db, loadEnv({ PUBLIC_URL: world.app.url }), trial!.id);
    const res = await fetch(world.api(`/trials/${trial!.id}`), {
      headers: world.people.reviewer.headers,
    });
    expect(res.status).toBe(200);
    const text = await res.text();
    expect(text).toContain('"condition":"Infinity"');
    expect(text).toContain('"growthFactor":"NaN"');
    const detail = trialDetailSchema.parse(parseWithNonFinite(text));
    expect(detail).toMatchObject({ status: 'completed', passed: true, verdict: { passed: true } });
    expect(detail.machine?.cpuModel).toBe('Invented CPU 3000');
    expect(detail.matrices.map((m) => m.id)).toEqual([
      'hilbert-8',
      'frame-bay-3, "east"',
      'singular-6',
    ]);
    expect(detail.matrices[2]!.condition).toBe(Infinity);
    // The reference solver's growth factor per matrix; the singular one was stored without.
    expect(detail.matrices.map((m) => m.referenceGrowth)).toEqual([1, 2.25, null]);
    expect(detail.matrices[1]!.incumbent!.metrics.factorRatio).toBe(Infinity);
    expect(detail.matrices[0]!.candidate.metrics.factorRatio).toBe(0.42);
    expect(detail.timing).toEqual([
      expect.objectContaining({ n: 64, ratio: 0.87, ci95: [0.84, 0.9], verdict: 'faster' }),
    ]);
  });

  it('serves a finished report again unchanged, checks access every time, and never keeps a running one', async () => {
    const { trial } = await submitted();
    const id = trial!.id;
    const read = async (person = world.people.reviewer) => {
      const res = await fetch(world.api(`/trials/${id}`), { headers: person.headers });
      return { status: res.status, detail: parseWithNonFinite(await res.text()) };
    };
    await writeProgress(world.db, id, { phase: 'accuracy', done: 1, total: 3 });
    expect((await read()).detail).toMatchObject({ status: 'running', matrices: [] });
    await finishTrial(world.db, loadEnv({ PUBLIC_URL: world.app.url }), id);
    const first = await read();
    expect(first.detail).toMatchObject({ status: 'completed' });
    expect((await read()).detail).toEqual(first.detail);
    expect((await read(world.people.outsider)).status).toBe(404);
    // A new try makes the trial unfinished again (attempts + 1, results deleted): the kept text
    // of the finished one must not be served for it.
    await world.db.delete(trialMatrixResults).where(eq(trialMatrixResults.trialId, id));
    await world.db
      .update(trials)
      .set({ status: 'running', attempts: sql`${trials.attempts} + 1`, finishedAt: null })
      .where(eq(trials.id, id));
    expect((await read()).detail).toMatchObject({ status: 'running', matrices: [] });
  });

  it('exports the per-matrix table as CSV', async () => {
    const seeded = await seedCandidate(
      world.db,
      world.routine,
      world.people.author.id,
      'in-review',
    );
    await world.db.insert(trialMatrixResults).values({
      trialId: seeded.trialId,
      position: 3,
      matrixId: '=HYPERLINK("http://example.test")',
      family: 'upload',
      m: 2,
      n: 2,
      expected: 'factor',
      referenceTrusted: true,
      note: '',
      candidate: { status: 'ok', metrics: { factorRatio: 0.1 }, ms: 0 },
      passed: true,
      failures: [],
    });
    const res = await fetch(world.api(`/trials/${seeded.trialId}/export.csv`), {
      headers: world.people.maintainer.headers,
    });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toContain(`trial-${seeded.trialId}.csv`);
    const lines = (await res.text()).trimEnd().split('\r\n');
    expect(lines).toHaveLength(5);
    const header = lines[0]!.split(',');
    expect(header.slice(0, 4)).toEqual(['matrix', 'family', 'm', 'n']);
    expect(header).toContain('candidate_factorRatio');
    expect(header).toContain('incumbent_factorRatio');
    expect(
      lines[1]!.startsWith('hilbert-8,hilbert,8,8,34000000000,exact,factor,true,true,ok'),
    ).toBe(true);
    expect(lines[2]!.startsWith('"frame-bay-3, ""east""",upload,12,12')).toBe(true);
    // The incumbent's factor ratio and growth factor, with componentwiseBoundRatio empty between.
    expect(lines[2]).toContain(',ok,0.31,Infinity,,NaN,');
    expect(lines[3]!.startsWith('singular-6,singular,6,6,Infinity,exact,reject')).toBe(true);
    expect(lines[4]!.startsWith(`"'=HYPERLINK(""http://example.test"")"`)).toBe(true);
  });

  it('lists a revision’s trials', async () => {
    const { revision, trial } = await submitted();
    const page = trialPageSchema.parse(
      (await call(world.api(`/revisions/${revision.id}/trials`), world.people.reviewer)).body,
    );
    expect(page.items.map((t) => t.id)).toEqual([trial!.id]);
    expect(page.items[0]).toMatchObject({ status: 'queued', candidateId: revision.candidateId });
  });
});

/** Reads server-sent events from a response body, one at a time. */
function eventReader(body: ReadableStream<Uint8Array>) {
  const reader = body.getReader();
  const decoder = new TextDecoder();
  let buffer = '';
  return async (): Promise<{ event: string; data: TrialEvent } | null> => {
    for (;;) {
      const end = buffer.indexOf('\n\n');
      if (end >= 0) {
        const block = buffer.slice(0, end);
        buffer = buffer.slice(end + 2);
        const event = /^event: (.+)$/m.exec(block)?.[1];
        const data = /^data: (.+)$/m.exec(block)?.[1];
        if (event && data) return { event, data: trialEventSchema.parse(JSON.parse(data)) };
        continue;
      }
      const { done, value } = await reader.read();
      if (done) return null;
      buffer += decoder.decode(value, { stream: true });
    }
  };
}

describe('live progress', () => {
  it('streams progress as the worker writes it, then the final event, and closes', async () => {
    const { trial } = await submitted();
    const id = trial!.id;
    const res = await fetch(world.api(`/trials/${id}/events`), {
      headers: world.people.author.headers,
    });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/event-stream/);
    const next = eventReader(res.body!);

    const first = await next();
    expect(first).toMatchObject({
      event: 'progress',
      data: { status: 'queued', progress: { phase: 'queued' } },
    });

    await writeProgress(world.db, id, { phase: 'accuracy', done: 1, total: 3, label: 'hilbert-8' });
    const second = await next();
    expect(second).toMatchObject({
      event: 'progress',
      data: { trialId: id, status: 'running', progress: { phase: 'accuracy', done: 1, total: 3 } },
    });

    await finishTrial(world.db, loadEnv({ PUBLIC_URL: world.app.url }), id);
    let last = await next();
    while (last?.event === 'progress') last = await next();
    expect(last).toMatchObject({ event: 'finished', data: { status: 'completed', passed: true } });
    expect(await next()).toBeNull();
  });

  it('sends the final event at once for a finished trial', async () => {
    const seeded = await seedCandidate(
      world.db,
      world.routine,
      world.people.author.id,
      'in-review',
    );
    const res = await fetch(world.api(`/trials/${seeded.trialId}/events`), {
      headers: world.people.reviewer.headers,
    });
    const next = eventReader(res.body!);
    expect(await next()).toMatchObject({ event: 'finished', data: { status: 'completed' } });
    expect(await next()).toBeNull();
  });

  it('answers errors as JSON before any stream starts', async () => {
    const seeded = await seedCandidate(
      world.db,
      world.routine,
      world.people.author.id,
      'in-review',
    );
    const url = world.api(`/trials/${seeded.trialId}/events`);
    expect((await call(url, null)).status).toBe(401);
    expect((await call(url, world.people.outsider)).status).toBe(404);
    expect((await call(world.api('/trials/99999999/events'), world.people.author)).status).toBe(
      404,
    );
  });

  it('lets a client go away mid-stream without disturbing the trial or the server', async () => {
    const { trial } = await submitted();
    const abort = new AbortController();
    const res = await fetch(world.api(`/trials/${trial!.id}/events`), {
      headers: world.people.author.headers,
      signal: abort.signal,
    });
    const next = eventReader(res.body!);
    expect((await next())?.event).toBe('progress');
    abort.abort();
    await expect(next()).rejects.toThrow();
    // The server still answers, and the trial is untouched.
    const detail = await call(world.api(`/trials/${trial!.id}`), world.people.author);
    expect(detail.body).toMatchObject({ status: 'queued' });
  });
});
