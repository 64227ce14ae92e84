import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { TestUser } from '@tests/helpers/users.ts';
import { call, goodKernel, startReviewWorld, type ReviewWorld } from './review-world.ts';
import { seedCandidate, seedPromotionHistory, type SeededCandidate } from './seed-candidates.ts';

let world: ReviewWorld;
beforeAll(async () => {
  world = await startReviewWorld(inject('databaseUrl'));
});
afterAll(() => world.close());

const callers = ['anonymous', 'author', 'reviewer', 'maintainer', 'other team', 'admin'] as const;
type Caller = (typeof callers)[number];

/**
 * Every route of the review process × every kind of caller. "author" wrote the candidate (role
 * author); "reviewer" and "maintainer" are team members with those roles; "other team" is a
 * maintainer of another team; "admin" administers the instance but is in no team.
 */
// prettier-ignore
const table: [route: string, statuses: Record<Caller, number>][] = [
  //                                          anonymous author reviewer maintainer other-team admin
  ['GET /routines/:id/candidates',    row(401, 200, 200, 200, 404, 404)],
  ['POST /routines/:id/candidates',   row(401, 201, 201, 201, 404, 404)],
  ['GET /candidates/:id',             row(401, 200, 200, 200, 404, 404)],
  ['POST /candidates/:id/revisions',  row(401, 201, 403, 403, 404, 404)],
  ['POST /candidates/:id/withdraw',   row(401, 200, 403, 200, 404, 404)],
  ['GET /revisions/:id',              row(401, 200, 200, 200, 404, 404)],
  ['GET /revisions/:id/trials',       row(401, 200, 200, 200, 404, 404)],
  ['GET /trials/:id',                 row(401, 200, 200, 200, 404, 404)],
  ['GET /trials/:id/export.csv',      row(401, 200, 200, 200, 404, 404)],
  ['GET /trials/:id/events',          row(401, 200, 200, 200, 404, 404)],
  ['GET /candidates/:id/comments',    row(401, 200, 200, 200, 404, 404)],
  ['POST /candidates/:id/comments',   row(401, 201, 201, 201, 404, 404)],
  ['POST /candidates/:id/reviews',    row(401, 403, 201, 201, 404, 404)],
  ['GET /routines/:id/cleared',       row(401, 403, 403, 200, 404, 404)],
  ['POST /candidates/:id/promote',    row(401, 403, 403, 201, 404, 404)],
  ['POST /routines/:id/reinstate',    row(401, 403, 403, 201, 404, 404)],
  ['GET /routines/:id/logbook',       row(401, 200, 200, 200, 404, 404)],
];

function row(...s: [number, number, number, number, number, number]): Record<Caller, number> {
  return Object.fromEntries(callers.map((c, i) => [c, s[i]!])) as Record<Caller, number>;
}

interface Request {
  method: 'GET' | 'POST';
  path: string;
  body?: unknown;
}

/** A fresh subject for each cell, so that one caller's success never changes the next cell. */
const seed = (state: 'in-review' | 'cleared'): Promise<SeededCandidate> =>
  seedCandidate(
    world.db,
    world.routine,
    world.people.author.id,
    state,
    state === 'cleared' ? [world.people.reviewer.id] : [],
  );

const requests: Record<string, () => Promise<Request>> = {
  'GET /routines/:id/candidates': async () => get(`/routines/${world.routine.id}/candidates`),
  'POST /routines/:id/candidates': async () =>
    post(`/routines/${world.routine.id}/candidates`, { title: 'Matrix cell', source: goodKernel }),
  'GET /candidates/:id': async () => get(`/candidates/${(await seed('in-review')).candidateId}`),
  'POST /candidates/:id/revisions': async () =>
    post(`/candidates/${(await seed('in-review')).candidateId}/revisions`, { source: goodKernel }),
  'POST /candidates/:id/withdraw': async () =>
    post(`/candidates/${(await seed('in-review')).candidateId}/withdraw`, {}),
  'GET /revisions/:id': async () => get(`/revisions/${(await seed('in-review')).revisionId}`),
  'GET /revisions/:id/trials': async () =>
    get(`/revisions/${(await seed('in-review')).revisionId}/trials`),
  'GET /trials/:id': async () => get(`/trials/${(await seed('in-review')).trialId}`),
  'GET /trials/:id/export.csv': async () =>
    get(`/trials/${(await seed('in-review')).trialId}/export.csv`),
  'GET /trials/:id/events': async () => get(`/trials/${(await seed('in-review')).trialId}/events`),
  'GET /candidates/:id/comments': async () =>
    get(`/candidates/${(await seed('in-review')).candidateId}/comments`),
  'POST /candidates/:id/comments': async () =>
    post(`/candidates/${(await seed('in-review')).candidateId}/comments`, { body: 'Looks sound.' }),
  'POST /candidates/:id/reviews': async () =>
    post(`/candidates/${(await seed('in-review')).candidateId}/reviews`, { verdict: 'sign-off' }),
  'GET /routines/:id/cleared': async () => get(`/routines/${world.routine.id}/cleared`),
  'POST /candidates/:id/promote': async () =>
    post(`/candidates/${(await seed('cleared')).candidateId}/promote`, { note: 'matrix' }),
  'POST /routines/:id/reinstate': async () => {
    const routine = await world.addRoutine();
    const { author, maintainer } = world.people;
    const { first } = await seedPromotionHistory(world.db, routine, author.id, maintainer.id);
    return post(`/routines/${routine.id}/reinstate`, { promotionId: first, note: 'matrix' });
  },
  'GET /routines/:id/logbook': async () => get(`/routines/${world.routine.id}/logbook`),
};

function get(path: string): Request {
  return { method: 'GET', path };
}
function post(path: string, body: unknown): Request {
  return { method: 'POST', path, body };
}

function userFor(caller: Caller): TestUser | null {
  const { people } = world;
  const users: Record<Caller, TestUser | null> = {
    anonymous: null,
    author: people.author,
    reviewer: people.reviewer,
    maintainer: people.maintainer,
    'other team': people.outsider,
    admin: people.admin,
  };
  return users[caller];
}

describe('who may call which route', () => {
  it('covers every route of the review process', () => {
    expect(Object.keys(requests).sort()).toEqual(table.map(([route]) => route).sort());
  });

  it.each(table)('%s', async (route, expected) => {
    const actual = {} as Record<Caller, number>;
    for (const caller of callers) {
      const request = await requests[route]!();
      const res = await call(
        world.api(request.path),
        userFor(caller),
        request.method,
        request.body,
      );
      actual[caller] = res.status;
    }
    expect(actual).toEqual(expected);
  });
});
