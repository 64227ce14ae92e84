import { randomUUID } from 'node:crypto';
import type { TeamRole } from '@shared/roles.ts';
import type { Db } from '@server/db/client.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';

export interface TeamRef {
  id: number;
  slug: string;
  name: string;
}

/** One person per kind of caller the authorization tests distinguish. */
export interface TeamPeople {
  author: TestUser;
  reviewer: TestUser;
  maintainer: TestUser;
  /** A maintainer of another team, in no role here. */
  outsider: TestUser;
  /** An instance admin who belongs to no team. */
  admin: TestUser;
}

export interface TeamWorld {
  team: TeamRef;
  /** The outsider's team. */
  otherTeam: TeamRef;
  people: TeamPeople;
}

/** A team straight in the database, with an invented name and a unique slug. */
export async function insertTeam(db: Db, name: string): Promise<TeamRef> {
  const slug = `team-${randomUUID().slice(0, 8)}`;
  const [row] = await db.insert(teams).values({ slug, name }).returning();
  return { id: row!.id, slug: row!.slug, name: row!.name };
}

export async function addMember(db: Db, teamId: number, user: TestUser, role: TeamRole) {
  await db.insert(memberships).values({ teamId, userId: user.id, role });
}

/**
 * An invented team with one member per role, a maintainer of another team and an admin who
 * belongs to no team; every person has a Bearer token. Each call makes new people and teams.
 */
export async function createTeamWorld(
  db: Db,
  name = 'Tragwerk Frame Analysis',
): Promise<TeamWorld> {
  const team = await insertTeam(db, name);
  const otherTeam = await insertTeam(db, 'Harbour Crane Controls');
  const people: TeamPeople = {
    author: await createTestUser(db),
    reviewer: await createTestUser(db),
    maintainer: await createTestUser(db),
    outsider: await createTestUser(db),
    admin: await createTestUser(db, { isAdmin: true }),
  };
  await addMember(db, team.id, people.author, 'author');
  await addMember(db, team.id, people.reviewer, 'reviewer');
  await addMember(db, team.id, people.maintainer, 'maintainer');
  await addMember(db, otherTeam.id, people.outsider, 'maintainer');
  return { team, otherTeam, people };
}

export interface ApiAnswer {
  status: number;
  /** Parsed JSON, or the text when the answer is not JSON. */
  body: unknown;
  headers: Headers;
}

export interface TeamFixture extends TeamWorld {
  app: RunningApp;
  db: Db;
  /** `/api` + path on the running app. */
  url: (path: string) => string;
  /** A JSON request to `/api` + path as `user` (anonymous when null). */
  call: (
    path: string,
    user: TestUser | null,
    method?: string,
    body?: unknown,
  ) => Promise<ApiAnswer>;
  /** A multipart POST to `/api` + path with one file in the field `file`. */
  postFile: (
    path: string,
    user: TestUser | null,
    content: string | Uint8Array<ArrayBuffer>,
    fileName?: string,
  ) => Promise<ApiAnswer>;
  close: () => Promise<void>;
}

/** Reads an answer as JSON when it is JSON, else as text. */
export async function readAnswer(res: Response): Promise<ApiAnswer> {
  const text = await res.text();
  let body: unknown = text;
  try {
    body = text === '' ? null : JSON.parse(text);
  } catch {
    // Not JSON (text/plain content, say): keep the text.
  }
  return { status: res.status, body, headers: res.headers };
}

/** The app on a free loopback port, with a team world in its database. Close it in afterAll. */
export async function startTeamFixture(databaseUrl: string): Promise<TeamFixture> {
  const app = await startTestApp(databaseUrl);
  const db = app.database.db;
  const world = await createTeamWorld(db);
  const url = (path: string) => `${app.url}/api${path}`;
  return {
    ...world,
    app,
    db,
    url,
    call: async (path, user, method = 'GET', body) =>
      readAnswer(
        await fetch(url(path), {
          method,
          headers: user ? user.headers : { 'content-type': 'application/json' },
          ...(body === undefined ? {} : { body: JSON.stringify(body) }),
        }),
      ),
    postFile: async (path, user, content, fileName = 'frame-stiffness.mtx') => {
      const form = new FormData();
      form.append('file', new Blob([content], { type: 'application/octet-stream' }), fileName);
      const headers = user ? { authorization: `Bearer ${user.token}` } : undefined;
      return readAnswer(await fetch(url(path), { method: 'POST', body: form, headers }));
    },
    close: () => app.close(),
  };
}
