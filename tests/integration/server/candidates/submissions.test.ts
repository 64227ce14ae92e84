import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { candidatePageSchema, submissionSchema } from '@shared/api/candidates.ts';
import { commentPageSchema, commentSchema } from '@shared/api/comments.ts';
import { revisionSchema } from '@shared/api/revisions.ts';
import { trialPageSchema } from '@shared/api/trials.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { eq } from 'drizzle-orm';
import { typeCheckerName } from '@sandbox/isolate/type-check-version.ts';
import { loadEnv } from '@server/config/env.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import type { TestUser } from '@tests/helpers/users.ts';
import { badKernel, call, goodKernel, startReviewWorld, type ReviewWorld } from './review-world.ts';
import { finishTrial } from './simulated-worker.ts';

let world: ReviewWorld;
beforeAll(async () => {
  world = await startReviewWorld(inject('databaseUrl'));
});
afterAll(() => world.close());

const candidatesUrl = () => world.api(`/routines/${world.routine.id}/candidates`);

async function submit(user: TestUser, source: string, title = 'Blocked LU') {
  const res = await call(candidatesUrl(), user, 'POST', { title, source });
  expect(res.status).toBe(201);
  return submissionSchema.parse(res.body);
}

/** A multipart upload of a kernel file as `user`. */
async function upload(url: string, user: TestUser, fileName: string, text: string, title?: string) {
  const form = new FormData();
  if (title) form.set('title', title);
  form.set('source', new Blob([text], { type: 'text/plain' }), fileName);
  const res = await fetch(url, {
    method: 'POST',
    headers: { authorization: user.headers.authorization! },
    body: form,
  });
  return { status: res.status, body: (await res.json()) as unknown };
}

const errorOf = (body: unknown) => apiErrorSchema.parse(body).error;

describe('submitting a candidate', () => {
  it('answers type errors at once: trial failed, diagnostics, no trial queued', async () => {
    const queued = world.queue.enqueued.length;
    const submission = await submit(world.people.author, badKernel, 'Wrong signature');
    expect(submission.candidate.state).toBe('trial-failed');
    expect(submission.trial).toBeNull();
    expect(submission.revision.diagnostics.length).toBeGreaterThan(0);
    expect(submission.revision.diagnostics[0]).toMatchObject({ file: 'kernel', line: 1 });
    expect(world.queue.enqueued.length).toBe(queued);
    const trials = await call(
      world.api(`/revisions/${submission.revision.id}/trials`),
      world.people.author,
    );
    expect(trialPageSchema.parse(trials.body).total).toBe(0);
    const revision = revisionSchema.parse(
      (await call(world.api(`/revisions/${submission.revision.id}`), world.people.reviewer)).body,
    );
    expect(revision.source).toBe(badKernel);
    expect(revision.errorCount).toBe(revision.diagnostics.length);
  });

  it('stores which checker found the diagnostics, so the trial need not check again', async () => {
    const good = await submit(world.people.author, goodKernel, 'Checked once');
    const bad = await submit(world.people.author, badKernel, 'Checked once, wrong');
    for (const submission of [good, bad]) {
      const [row] = await world.db
        .select({ checkedWith: revisions.checkedWith, diagnostics: revisions.diagnostics })
        .from(revisions)
        .where(eq(revisions.id, submission.revision.id));
      expect(row!.checkedWith).toBe(typeCheckerName);
      expect(row!.diagnostics).toEqual(submission.revision.diagnostics);
    }
    expect(good.revision.diagnostics).toEqual([]);
    expect(good.trial).not.toBeNull();
  });

  it('answers other requests while a submission is being type-checked', async () => {
    // A long kernel keeps the check busy for a second or more; the list is read meanwhile,
    // one request after another. A check on the request thread would let through at most the
    // reads already in flight when it started and the one racing the rest of the submission
    // (two or three); off the thread the reads go on all through the check.
    const helpers = Array.from(
      { length: 500 },
      (_, i) => `export function helper${i}(x: Float64Array): number {\n  return x[0]! + ${i};\n}`,
    );
    const longKernel = [goodKernel, ...helpers].join('\n');
    let checking = true;
    const posted = submit(world.people.author, longKernel, 'Long kernel').finally(() => {
      checking = false;
    });
    let answeredWhileChecking = 0;
    while (checking) {
      const res = await call(candidatesUrl(), world.people.reviewer);
      expect(res.status).toBe(200);
      if (checking) answeredWhileChecking++;
    }
    expect((await posted).revision.diagnostics).toEqual([]);
    expect(answeredWhileChecking).toBeGreaterThanOrEqual(10);
  }, 120_000);

  it('takes a .ts file upload with the title as a form field', async () => {
    const res = await upload(
      candidatesUrl(),
      world.people.reviewer,
      'blocked-lu.ts',
      goodKernel,
      'Uploaded LU',
    );
    expect(res.status).toBe(201);
    const submission = submissionSchema.parse(res.body);
    expect(submission.revision.source).toBe(goodKernel);
    expect(submission.candidate).toMatchObject({ title: 'Uploaded LU', state: 'on-trial' });
    expect(world.queue.enqueued).toContain(submission.trial!.id);
  });

  it('refuses an upload over 200 kB, a file that is not .ts, and a second file field', async () => {
    const big = `// ${'x'.repeat(200_001)}\n${goodKernel}`;
    const tooBig = await upload(candidatesUrl(), world.people.author, 'big.ts', big, 'Big');
    expect(tooBig.status).toBe(413);
    expect(errorOf(tooBig.body).code).toBe('payload-too-large');

    const js = await upload(candidatesUrl(), world.people.author, 'lu.js', goodKernel, 'JS');
    expect(js.status).toBe(400);
    expect(errorOf(js.body).message).toContain('.ts');

    const form = new FormData();
    form.set('title', 'Wrong field');
    form.set('kernel', new Blob([goodKernel]), 'lu.ts');
    const res = await fetch(candidatesUrl(), {
      method: 'POST',
      headers: { authorization: world.people.author.headers.authorization! },
      body: form,
    });
    expect(res.status).toBe(400);
  });

  it('validates the body, the query and the ids', async () => {
    const { author } = world.people;
    const noTitle = await call(candidatesUrl(), author, 'POST', { source: goodKernel });
    expect(noTitle.status).toBe(400);
    expect(JSON.stringify(errorOf(noTitle.body).details)).toContain('title');

    const blank = await call(candidatesUrl(), author, 'POST', { title: 'Blank', source: '  \n' });
    expect(blank.status).toBe(400);
    expect(JSON.stringify(errorOf(blank.body).details)).toContain('source');

    const huge = await call(candidatesUrl(), author, 'POST', {
      title: 'Huge',
      source: 'x'.repeat(200_001),
    });
    expect(huge.status).toBe(400);

    expect((await call(`${candidatesUrl()}?state=sleeping`, author)).status).toBe(400);
    expect((await call(`${candidatesUrl()}?limit=0`, author)).status).toBe(400);
    expect((await call(world.api('/candidates/abc'), author)).status).toBe(400);
    expect((await call(world.api('/candidates/999999'), author)).status).toBe(404);
    expect((await call(world.api('/routines/999999/candidates'), author)).status).toBe(404);
  });

  it('lists a routine’s candidates by state, one page at a time', async () => {
    const { author } = world.people;
    const failed = await call(`${candidatesUrl()}?state=trial-failed`, author);
    const page = candidatePageSchema.parse(failed.body);
    expect(page.items.length).toBeGreaterThan(0);
    expect(page.items.every((c) => c.state === 'trial-failed')).toBe(true);
    const first = candidatePageSchema.parse(
      (await call(`${candidatesUrl()}?limit=1`, author)).body,
    );
    expect(first.items).toHaveLength(1);
    expect(first.total).toBeGreaterThan(1);
  });
});

describe('revising a candidate', () => {
  it('puts each new revision by the author on trial, numbered in order', async () => {
    const { author, reviewer } = world.people;
    const first = await submit(author, badKernel, 'Fixed in revision 2');
    const url = world.api(`/candidates/${first.candidate.id}/revisions`);

    expect((await call(url, reviewer, 'POST', { source: goodKernel })).status).toBe(403);

    const second = await call(url, author, 'POST', { source: goodKernel });
    expect(second.status).toBe(201);
    const revised = submissionSchema.parse(second.body);
    expect(revised.revision.number).toBe(2);
    expect(revised.candidate).toMatchObject({ state: 'on-trial', latestRevision: 2 });
    expect(world.queue.enqueued).toContain(revised.trial!.id);

    // Not while the trial runs.
    const busy = await call(url, author, 'POST', { source: goodKernel });
    expect(busy.status).toBe(409);

    await finishTrial(world.db, loadEnv({ PUBLIC_URL: world.app.url }), revised.trial!.id);
    const third = await upload(url, author, 'lu-v3.ts', `${goodKernel}\n// tidied\n`);
    expect(third.status).toBe(201);
    expect(submissionSchema.parse(third.body).revision.number).toBe(3);
  });

  it('lets the author or a maintainer withdraw, once', async () => {
    const { author, maintainer, reviewer } = world.people;
    const mine = await submit(author, goodKernel, 'To be withdrawn');
    const url = world.api(`/candidates/${mine.candidate.id}/withdraw`);
    expect((await call(url, reviewer, 'POST')).status).toBe(403);
    const withdrawn = await call(url, author, 'POST');
    expect(withdrawn.status).toBe(200);
    expect(withdrawn.body).toMatchObject({ state: 'withdrawn' });
    expect((await call(url, maintainer, 'POST')).status).toBe(409);
    const revise = await call(
      world.api(`/candidates/${mine.candidate.id}/revisions`),
      author,
      'POST',
      {
        source: goodKernel,
      },
    );
    expect(revise.status).toBe(409);
  });
});

describe('comments', () => {
  it('takes general and line comments; the line must exist in that revision', async () => {
    const { author, reviewer } = world.people;
    const subject = await submit(author, goodKernel, 'Commented on');
    const other = await submit(author, goodKernel, 'Another one');
    const url = world.api(`/candidates/${subject.candidate.id}/comments`);
    const lines = goodKernel.trimEnd().split('\n').length;

    const general = await call(url, reviewer, 'POST', { body: 'Why not a blocked version?' });
    expect(general.status).toBe(201);
    const onLine = await call(url, reviewer, 'POST', {
      body: 'The pivot search ties go to the first entry.',
      revisionId: subject.revision.id,
      line: lines,
    });
    expect(onLine.status).toBe(201);
    expect(commentSchema.parse(onLine.body)).toMatchObject({ line: lines, revisionNumber: 1 });
    const answer = await call(url, author, 'POST', { body: 'As LAPACK does.' });
    expect(answer.status).toBe(201);

    const pastEnd = await call(url, reviewer, 'POST', {
      body: 'x',
      revisionId: subject.revision.id,
      line: lines + 1,
    });
    expect(pastEnd.status).toBe(400);
    const noRevision = await call(url, reviewer, 'POST', { body: 'x', line: 1 });
    expect(noRevision.status).toBe(400);
    const foreign = await call(url, reviewer, 'POST', {
      body: 'x',
      revisionId: other.revision.id,
      line: 1,
    });
    expect(foreign.status).toBe(400);
    expect((await call(url, reviewer, 'POST', { body: '   ' })).status).toBe(400);

    const page = commentPageSchema.parse((await call(url, author)).body);
    expect(page.items.map((c) => c.body)).toEqual([
      'Why not a blocked version?',
      'The pivot search ties go to the first entry.',
      'As LAPACK does.',
    ]);
  });
});
