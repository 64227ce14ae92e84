import { randomUUID } from 'node:crypto';
import { defaultAcceptancePolicy, type AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { TeamRole } from '@shared/roles.ts';
import type { RoutineSlug } from '@shared/routines.ts';
import type { Db } from '@server/db/client.ts';
import { matrixSets } from '@server/db/schema/matrix-sets.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { routines } from '@server/db/schema/routines.ts';
import { teams } from '@server/db/schema/teams.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';
import { fakeTrialQueue, type FakeTrialQueue } from './fake-trial-queue.ts';

export type RoutineRow = typeof routines.$inferSelect;

/** A kernel that satisfies the LU-with-partial-pivoting contract. */
export const goodKernel = readKernelSource('starters/lu-partial-pivoting.ts');
/** A kernel whose `factor` does not match the contract. */
export const badKernel = 'export function factor(a: string): number {\n  return a.length;\n}\n';

export interface People {
  /** Has the author role; writes the candidates in these tests. */
  author: TestUser;
  reviewer: TestUser;
  secondReviewer: TestUser;
  maintainer: TestUser;
  /** A maintainer of another team. */
  outsider: TestUser;
  /** An instance admin with no membership in the team. */
  admin: TestUser;
}

export interface ReviewWorld {
  app: RunningApp;
  db: Db;
  queue: FakeTrialQueue;
  team: { id: number; slug: string; name: string };
  routine: RoutineRow;
  people: People;
  api: (path: string) => string;
  /** Another routine of the same team, with its own matrix set and policy. */
  addRoutine: (policy?: Partial<AcceptancePolicy>) => Promise<RoutineRow>;
  close: () => Promise<void>;
}

async function createTeam(db: Db, name: string) {
  const slug = `team-${randomUUID().slice(0, 8)}`;
  const [team] = await db.insert(teams).values({ slug, name }).returning();
  return team!;
}

async function join(db: Db, teamId: number, user: TestUser, role: TeamRole) {
  await db.insert(memberships).values({ teamId, userId: user.id, role });
}

/** A routine with a fresh matrix set; its policy is the default with `policy` laid over it. */
export async function createRoutine(
  db: Db,
  teamId: number,
  policy: Partial<AcceptancePolicy> = {},
  contract: RoutineSlug = 'lu-partial-pivoting',
): Promise<RoutineRow> {
  const tag = randomUUID().slice(0, 8);
  const [set] = await db
    .insert(matrixSets)
    .values({ teamId, name: `frame stiffness ${tag}`, timingSizes: [64, 128] })
    .returning();
  const [routine] = await db
    .insert(routines)
    .values({
      teamId,
      slug: `lu-${tag}`,
      title: `Frame solver LU ${tag}`,
      contract,
      policy: { ...defaultAcceptancePolicy, ...policy },
      matrixSetId: set!.id,
    })
    .returning();
  return routine!;
}

/**
 * The app with an in-memory trial queue, and an invented structural-analysis team: one person
 * per role, a maintainer of another team, and an admin who belongs to no team.
 */
export async function startReviewWorld(
  databaseUrl: string,
  policy: Partial<AcceptancePolicy> = {},
): Promise<ReviewWorld> {
  const queue = fakeTrialQueue();
  const app = await startTestApp(databaseUrl, undefined, {}, queue);
  const db = app.database.db;
  const team = await createTeam(db, 'Tragwerk Frame Analysis');
  const other = await createTeam(db, 'Harbour Crane Controls');
  const people: People = {
    author: await createTestUser(db),
    reviewer: await createTestUser(db),
    secondReviewer: await createTestUser(db),
    maintainer: await createTestUser(db),
    outsider: await createTestUser(db),
    admin: await createTestUser(db, { isAdmin: true }),
  };
  await join(db, team.id, people.author, 'author');
  await join(db, team.id, people.reviewer, 'reviewer');
  await join(db, team.id, people.secondReviewer, 'reviewer');
  await join(db, team.id, people.maintainer, 'maintainer');
  await join(db, other.id, people.outsider, 'maintainer');
  const routine = await createRoutine(db, team.id, policy);
  return {
    app,
    db,
    queue,
    team,
    routine,
    people,
    api: (path) => `${app.url}/api${path}`,
    addRoutine: (p = {}) => createRoutine(db, team.id, p),
    close: () => app.close(),
  };
}

/** The e-mail address createTestUser gives a person. */
export const addressOf = (user: TestUser) => `${user.login}@example.test`;

/** A JSON request as `user` (or anonymous), answering status and parsed body. */
export async function call(
  url: string,
  user: TestUser | null,
  method = 'GET',
  body?: unknown,
): Promise<{ status: number; body: unknown }> {
  const res = await fetch(url, {
    method,
    headers: user ? user.headers : { 'content-type': 'application/json' },
    ...(body === undefined ? {} : { body: JSON.stringify(body) }),
  });
  const text = await res.text();
  let parsed: unknown = text;
  try {
    parsed = JSON.parse(text);
  } catch {
    // Not JSON (CSV, an event stream): keep the text.
  }
  return { status: res.status, body: parsed };
}
