import { randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { defaultAcceptancePolicy } from '@shared/acceptance-policy.ts';
import { hashSecret } from '@server/auth/api-token-secret.ts';
import { invitations } from '@server/db/schema/invitations.ts';
import { matrixSetItems, matrixSets } from '@server/db/schema/matrix-sets.ts';
import { routines } from '@server/db/schema/routines.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import {
  addMember,
  insertTeam,
  startTeamFixture,
  type TeamFixture,
} from '@tests/helpers/team-fixture.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';

let f: TeamFixture;
let routineId: number;
let uploadId: number;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
  const [routine] = await f.db
    .insert(routines)
    .values({
      teamId: f.team.id,
      slug: 'frame-lu',
      title: 'Frame solver LU',
      contract: 'lu-partial-pivoting',
      policy: defaultAcceptancePolicy,
      matrixSetId: await freshSet(),
    })
    .returning();
  routineId = routine!.id;
  const [upload] = await f.db
    .insert(uploads)
    .values({
      teamId: f.team.id,
      fileName: 'frame.mtx',
      content: matrixFile,
      bytes: matrixFile.length,
      rows: 2,
      cols: 2,
      entries: 2,
      symmetry: 'general',
      field: 'real',
      format: 'coordinate',
      uploadedBy: f.people.maintainer.id,
    })
    .returning();
  uploadId = upload!.id;
});
afterAll(() => f.close());

const matrixFile = '%%MatrixMarket matrix coordinate real general\n2 2 2\n1 1 4.0\n2 2 3.0\n';

const callers = ['anonymous', 'author', 'reviewer', 'maintainer', 'other team', 'admin'] as const;
type Caller = (typeof callers)[number];

/**
 * Every route of the team side × every kind of caller. "author", "reviewer" and "maintainer"
 * are members of the team with that role; "other team" is a maintainer of another team; "admin"
 * administers the instance and belongs to no team. Admins create teams and manage any team's
 * members and invitations; everything else inside a team is hidden from them like from any
 * outsider (404). Accepting an invitation is open to anyone signed in who holds the link.
 */
// prettier-ignore
const table: [route: string, statuses: Record<Caller, number>][] = [
  //                                                    anonymous author reviewer maintainer other-team admin
  ['GET /teams',                                      row(401, 200, 200, 200, 200, 200)],
  ['POST /teams',                                     row(401, 403, 403, 403, 403, 201)],
  ['GET /teams/:teamId',                              row(401, 200, 200, 200, 404, 200)],
  ['GET /teams/:teamId/members',                      row(401, 200, 200, 200, 404, 200)],
  ['PATCH /teams/:teamId/members/:userId',            row(401, 403, 403, 200, 404, 200)],
  ['DELETE /teams/:teamId/members/:userId',           row(401, 403, 403, 204, 404, 204)],
  ['POST /teams/:teamId/invitations',                 row(401, 403, 403, 201, 404, 201)],
  ['GET /teams/:teamId/invitations',                  row(401, 403, 403, 200, 404, 200)],
  ['DELETE /teams/:teamId/invitations/:id',           row(401, 403, 403, 200, 404, 200)],
  ['POST /invitations/accept',                        row(401, 200, 200, 200, 200, 200)],
  ['GET /teams/:teamId/routines',                     row(401, 200, 200, 200, 404, 404)],
  ['POST /teams/:teamId/routines',                    row(401, 403, 403, 201, 404, 404)],
  ['GET /routines/:id',                               row(401, 200, 200, 200, 404, 404)],
  ['PATCH /routines/:id',                             row(401, 403, 403, 200, 404, 404)],
  ['GET /teams/:teamId/matrix-sets',                  row(401, 200, 200, 200, 404, 404)],
  ['POST /teams/:teamId/matrix-sets',                 row(401, 403, 403, 201, 404, 404)],
  ['GET /matrix-sets/:id',                            row(401, 200, 200, 200, 404, 404)],
  ['PUT /matrix-sets/:id',                            row(401, 403, 403, 200, 404, 404)],
  ['DELETE /matrix-sets/:id',                         row(401, 403, 403, 204, 404, 404)],
  ['POST /teams/:teamId/uploads',                     row(401, 403, 403, 201, 404, 404)],
  ['POST /teams/:teamId/uploads/preview',             row(401, 403, 403, 200, 404, 404)],
  ['GET /teams/:teamId/uploads',                      row(401, 200, 200, 200, 404, 404)],
  ['GET /uploads/:id/content',                        row(401, 200, 200, 200, 404, 404)],
  ['GET /teams/:teamId/audit',                        row(401, 403, 403, 200, 404, 404)],
];

function row(...s: [number, number, number, number, number, number]): Record<Caller, number> {
  return Object.fromEntries(callers.map((c, i) => [c, s[i]!])) as Record<Caller, number>;
}

interface Request {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  path: string;
  body?: unknown;
  /** Sent as multipart, in the field `file`. */
  file?: string;
}

const tag = () => randomUUID().slice(0, 8);

/** A fresh unused matrix set of the team with one generated matrix. */
async function freshSet(): Promise<number> {
  const [set] = await f.db
    .insert(matrixSets)
    .values({ teamId: f.team.id, name: `cell ${tag()}`, timingSizes: [32] })
    .returning();
  await f.db
    .insert(matrixSetItems)
    .values({ matrixSetId: set!.id, position: 0, kind: 'generated', family: 'hilbert', n: 4 });
  return set!.id;
}

/** A fresh author of the team, for cells that change or remove a member. */
async function freshMember(): Promise<TestUser> {
  const user = await createTestUser(f.db);
  await addMember(f.db, f.team.id, user, 'author');
  return user;
}

/**
 * A fresh pending invitation (of the team, or of `teamId`); answers its id and the secret of its
 * link. Accepting cells use a scratch team, so that accepting never makes a caller a member of
 * the team the other rows are about.
 */
async function freshInvitation(teamId = f.team.id): Promise<{ id: number; token: string }> {
  const token = randomBytes(32).toString('base64url');
  const [row] = await f.db
    .insert(invitations)
    .values({
      teamId,
      email: `cell-${tag()}@frame.example`,
      role: 'author',
      tokenHash: hashSecret(token),
      invitedBy: f.people.maintainer.id,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  return { id: row!.id, token };
}

const team = () => `/teams/${f.team.id}`;
const setBody = () => ({
  name: `cell ${tag()}`,
  timingSizes: [32],
  items: [{ kind: 'generated', family: 'minij', n: 5 }],
});

const requests: Record<string, () => Promise<Request>> = {
  'GET /teams': async () => ({ method: 'GET', path: '/teams' }),
  'POST /teams': async () => ({
    method: 'POST',
    path: '/teams',
    body: { name: 'Cell team', slug: `cell-${tag()}` },
  }),
  'GET /teams/:teamId': async () => ({ method: 'GET', path: team() }),
  'GET /teams/:teamId/members': async () => ({ method: 'GET', path: `${team()}/members` }),
  'PATCH /teams/:teamId/members/:userId': async () => ({
    method: 'PATCH',
    path: `${team()}/members/${(await freshMember()).id}`,
    body: { role: 'reviewer' },
  }),
  'DELETE /teams/:teamId/members/:userId': async () => ({
    method: 'DELETE',
    path: `${team()}/members/${(await freshMember()).id}`,
  }),
  'POST /teams/:teamId/invitations': async () => ({
    method: 'POST',
    path: `${team()}/invitations`,
    body: { email: `cell-${tag()}@frame.example`, role: 'author' },
  }),
  'GET /teams/:teamId/invitations': async () => ({ method: 'GET', path: `${team()}/invitations` }),
  'DELETE /teams/:teamId/invitations/:id': async () => ({
    method: 'DELETE',
    path: `${team()}/invitations/${(await freshInvitation()).id}`,
  }),
  'POST /invitations/accept': async () => ({
    method: 'POST',
    path: '/invitations/accept',
    body: { token: (await freshInvitation((await insertTeam(f.db, 'Scratch team')).id)).token },
  }),
  'GET /teams/:teamId/routines': async () => ({ method: 'GET', path: `${team()}/routines` }),
  'POST /teams/:teamId/routines': async () => ({
    method: 'POST',
    path: `${team()}/routines`,
    body: {
      slug: `cell-${tag()}`,
      title: 'Cell routine',
      contract: 'cholesky',
      matrixSetId: await freshSet(),
    },
  }),
  'GET /routines/:id': async () => ({ method: 'GET', path: `/routines/${routineId}` }),
  'PATCH /routines/:id': async () => ({
    method: 'PATCH',
    path: `/routines/${routineId}`,
    body: { description: `Checked by cell ${tag()}` },
  }),
  'GET /teams/:teamId/matrix-sets': async () => ({ method: 'GET', path: `${team()}/matrix-sets` }),
  'POST /teams/:teamId/matrix-sets': async () => ({
    method: 'POST',
    path: `${team()}/matrix-sets`,
    body: setBody(),
  }),
  'GET /matrix-sets/:id': async () => ({ method: 'GET', path: `/matrix-sets/${await freshSet()}` }),
  'PUT /matrix-sets/:id': async () => ({
    method: 'PUT',
    path: `/matrix-sets/${await freshSet()}`,
    body: setBody(),
  }),
  'DELETE /matrix-sets/:id': async () => ({
    method: 'DELETE',
    path: `/matrix-sets/${await freshSet()}`,
  }),
  'POST /teams/:teamId/uploads': async () => ({
    method: 'POST',
    path: `${team()}/uploads`,
    file: matrixFile,
  }),
  'POST /teams/:teamId/uploads/preview': async () => ({
    method: 'POST',
    path: `${team()}/uploads/preview`,
    file: matrixFile,
  }),
  'GET /teams/:teamId/uploads': async () => ({ method: 'GET', path: `${team()}/uploads` }),
  'GET /uploads/:id/content': async () => ({ method: 'GET', path: `/uploads/${uploadId}/content` }),
  'GET /teams/:teamId/audit': async () => ({ method: 'GET', path: `${team()}/audit` }),
};

function userFor(caller: Caller): TestUser | null {
  const { people } = f;
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

describe('who may call which route of the team side', () => {
  it('covers every route', () => {
    expect(Object.keys(requests).sort()).toEqual(table.map(([route]) => route).sort());
  });

  it.each(table)('%s', async (route, expected) => {
    const actual = {} as Record<Caller, number>;
    for (const caller of callers) {
      const request = await requests[route]!();
      const user = userFor(caller);
      const res =
        request.file === undefined
          ? await f.call(request.path, user, request.method, request.body)
          : await f.postFile(request.path, user, request.file);
      actual[caller] = res.status;
    }
    expect(actual).toEqual(expected);
  });
});
