import { matrixSetInputSchema, type MatrixSetItemInput } from '@shared/api/matrix-sets.ts';
import { createRoutineSchema } from '@shared/api/routines.ts';
import type { TeamRole } from '@shared/roles.ts';
import type { MatrixSet } from '@sandbox/matrices/sets.ts';
import { generateApiToken } from '@server/auth/api-token-secret.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { apiTokens } from '@server/db/schema/api-tokens.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { users } from '@server/db/schema/users.ts';
import { createMatrixSet } from '@server/matrix-sets/matrix-sets.service.ts';
import { createRoutine } from '@server/routines/routines.service.ts';

/** A member of the benchmark's team with a live API token (the load client sends it). */
export interface BenchPerson {
  user: CurrentUser;
  role: TeamRole;
  token: string;
}

export interface BenchTeam {
  teamId: number;
  /** The first person is the maintainer; the others alternate author and reviewer. */
  people: BenchPerson[];
  maintainer: CurrentUser;
}

// Invented people of the invented firm Hallbrook & Vey.
const names = [
  'Ines Marlowe',
  'Tomas Quill',
  'Ada Brennan',
  'Kofi Ansel',
  'Mira Solberg',
  'Jonah Pike',
  'Lena Ostrow',
  'Ravi Castell',
];

/**
 * The team of Hallbrook & Vey's structures group, straight in the database: `people` members
 * (one maintainer, then authors and reviewers), each with an API token. Several tokens, because
 * 50 concurrent clients are several people, and every request with a token records its use.
 */
export async function seedTeam(db: Db, people: number): Promise<BenchTeam> {
  const [team] = await db
    .insert(teams)
    .values({ slug: 'hallbrook-vey-structures', name: 'Hallbrook & Vey — Structures' })
    .returning();
  const out: BenchPerson[] = [];
  for (let i = 0; i < people; i++) {
    const name = names[i % names.length]!;
    const login = `${name.toLowerCase().replace(/\s+/g, '-')}-${i}`;
    const [user] = await db
      .insert(users)
      .values({
        githubId: `bench-${i}`,
        login,
        displayName: name,
        email: `${login}@hallbrook-vey.example`,
      })
      .returning();
    const role: TeamRole = i === 0 ? 'maintainer' : i % 2 === 1 ? 'author' : 'reviewer';
    await db.insert(memberships).values({ teamId: team!.id, userId: user!.id, role });
    const { token, hash, prefix } = generateApiToken();
    await db
      .insert(apiTokens)
      .values({ userId: user!.id, name: 'service benchmark', tokenHash: hash, prefix });
    out.push({
      user: { id: user!.id, login, isAdmin: false, via: 'token' },
      role,
      token,
    });
  }
  return { teamId: team!.id, people: out, maintainer: out[0]!.user };
}

/** The engine's named set as the API's input: its generated recipes and timing sizes. */
function setInput(set: MatrixSet, name: string, description: string) {
  const items: MatrixSetItemInput[] = set.items.map((item) => {
    if (item.kind !== 'generated') throw new RangeError('named sets hold generated items only');
    const { family, n, m, seed, params } = item.spec;
    return {
      kind: 'generated',
      family,
      n,
      ...(m === undefined ? {} : { m }),
      ...(seed === undefined ? {} : { seed }),
      ...(params === undefined ? {} : { params }),
    };
  });
  return matrixSetInputSchema.parse({ name, description, timingSizes: set.timingSizes, items });
}

/** A matrix set of the team built through the service the API uses; its id. */
export async function seedMatrixSet(
  db: Db,
  team: BenchTeam,
  set: MatrixSet,
  name: string,
): Promise<number> {
  const created = await createMatrixSet(
    db,
    team.maintainer,
    team.teamId,
    setInput(set, name, `The engine's ${set.name} set.`),
  );
  return created.id;
}

/** An LU routine of the team on a matrix set, through the service the API uses; its id. */
export async function seedLuRoutine(
  db: Db,
  team: BenchTeam,
  matrixSetId: number,
  slug: string,
  title: string,
): Promise<number> {
  const created = await createRoutine(
    db,
    team.maintainer,
    team.teamId,
    createRoutineSchema.parse({
      slug,
      title,
      contract: 'lu-partial-pivoting',
      matrixSetId,
      policy: { allowedSlowdown: 0.25 },
    }),
  );
  return created.id;
}
