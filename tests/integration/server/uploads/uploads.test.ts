import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  matrixMarketProblemSchema,
  matrixMarketSummarySchema,
  maxUploadBytes,
  uploadPageSchema,
  uploadSchema,
} from '@shared/api/uploads.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import {
  createTeamWorld,
  startTeamFixture,
  type TeamFixture,
} from '@tests/helpers/team-fixture.ts';
import type { TestUser } from '@tests/helpers/users.ts';

let f: TeamFixture;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
});
afterAll(() => f.close());

/** An invented 4×4 stiffness matrix of a small frame, lower triangle only. */
const stiffness = [
  '%%MatrixMarket matrix coordinate real symmetric',
  '% Invented stiffness matrix of a two-bay frame (kN/mm).',
  '4 4 7',
  '1 1 12.5',
  '2 1 -6.25',
  '2 2 25.0',
  '3 2 -6.25',
  '3 3 25.0',
  '4 3 -6.25',
  '4 4 12.5',
  '',
].join('\n');

/** The same, with a bad value on line 6. */
const broken = stiffness.replace('2 2 25.0', '2 2 twenty-five');

const upload = (
  path: string,
  user: TestUser | null,
  content: string | Uint8Array<ArrayBuffer>,
  fileName?: string,
) => f.postFile(path, user, content, fileName);

const teamUploads = (teamId: number) =>
  f.db.select().from(uploads).where(eq(uploads.teamId, teamId));

describe('Matrix Market uploads', () => {
  it('previews a good file without storing it', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const res = await upload(`/teams/${team.id}/uploads/preview`, people.maintainer, stiffness);
    expect(res.status).toBe(200);
    expect(matrixMarketSummarySchema.parse(res.body)).toEqual({
      fileName: 'frame-stiffness.mtx',
      bytes: Buffer.byteLength(stiffness),
      rows: 4,
      cols: 4,
      entries: 7,
      symmetry: 'symmetric',
      field: 'real',
      format: 'coordinate',
    });
    expect(await teamUploads(team.id)).toHaveLength(0);
  });

  it('stores a good file with what parsing found, lists it and serves its content', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const res = await upload(`/teams/${team.id}/uploads`, people.maintainer, stiffness);
    expect(res.status).toBe(201);
    const stored = uploadSchema.parse(res.body);
    expect(stored).toMatchObject({
      teamId: team.id,
      fileName: 'frame-stiffness.mtx',
      rows: 4,
      cols: 4,
      entries: 7,
      symmetry: 'symmetric',
      uploadedBy: { id: people.maintainer.id, login: people.maintainer.login },
    });

    const page = uploadPageSchema.parse(
      (await f.call(`/teams/${team.id}/uploads`, people.author)).body,
    );
    expect(page.items.map((u) => u.id)).toEqual([stored.id]);
    expect(JSON.stringify(page)).not.toContain('Invented stiffness');

    const content = await f.call(`/uploads/${stored.id}/content`, people.reviewer);
    expect(content.status).toBe(200);
    expect(content.headers.get('content-type')).toMatch(/^text\/plain/);
    expect(content.body).toBe(stiffness);

    const [audit] = await f.db.select().from(auditLog).where(eq(auditLog.teamId, team.id));
    expect(audit).toMatchObject({
      action: 'upload.created',
      entityId: stored.id,
      actorId: people.maintainer.id,
    });
  });

  it('rejects a file that does not parse with its line and reason, storing nothing', async () => {
    const { team, people } = await createTeamWorld(f.db);
    for (const path of [`/teams/${team.id}/uploads`, `/teams/${team.id}/uploads/preview`]) {
      const res = await upload(path, people.maintainer, broken);
      expect(res.status, path).toBe(400);
      const { error } = res.body as { error: { code: string; message: string; details: unknown } };
      expect(error.code).toBe('validation-failed');
      const problem = matrixMarketProblemSchema.parse(error.details);
      expect(problem.line).toBe(6);
      expect(problem.reason).toMatch(/twenty-five|value/);
      expect(error.message).toContain('line 6');
    }
    expect(await teamUploads(team.id)).toHaveLength(0);
    expect(await f.db.select().from(auditLog).where(eq(auditLog.teamId, team.id))).toHaveLength(0);
  });

  it('rejects a file that declares a huge size before allocating it', async () => {
    const huge =
      '%%MatrixMarket matrix coordinate real general\n1000000000 1000000000 1\n1 1 1.0\n';
    const res = await upload(`/teams/${f.team.id}/uploads/preview`, f.people.maintainer, huge);
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ error: { details: { line: 2 } } });
  });

  it('answers 413 for a file over 8 MiB and stores nothing', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const big = new Uint8Array(maxUploadBytes + 1).fill(0x20);
    const res = await upload(`/teams/${team.id}/uploads`, people.maintainer, big);
    expect(res.status).toBe(413);
    expect(res.body).toMatchObject({ error: { code: 'payload-too-large' } });
    expect(await teamUploads(team.id)).toHaveLength(0);
  });

  it('refuses a file that is not .mtx, a missing file and a JSON body', async () => {
    const path = `/teams/${f.team.id}/uploads/preview`;
    const named = await upload(path, f.people.maintainer, stiffness, 'frame.txt');
    expect(named.status).toBe(400);
    expect(named.body).toMatchObject({ error: { message: expect.stringMatching(/\.mtx/) } });

    const empty = new FormData();
    empty.append('note', 'no file here');
    const noFile = await fetch(f.url(path), {
      method: 'POST',
      body: empty,
      headers: { authorization: `Bearer ${f.people.maintainer.token}` },
    });
    expect(noFile.status).toBe(400);

    const json = await f.call(path, f.people.maintainer, 'POST', { file: stiffness });
    expect(json.status).toBe(400);
  });

  it('keeps a file name without folders', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const res = await upload(
      `/teams/${team.id}/uploads`,
      people.maintainer,
      stiffness,
      '../../etc/frame.mtx',
    );
    expect(res.status).toBe(201);
    expect(uploadSchema.parse(res.body).fileName).toBe('frame.mtx');
  });

  it('serves content only to members of the upload’s team', async () => {
    const res = await upload(`/teams/${f.team.id}/uploads`, f.people.maintainer, stiffness);
    const { id } = uploadSchema.parse(res.body);
    expect((await f.call(`/uploads/${id}/content`, f.people.outsider)).status).toBe(404);
    expect((await f.call(`/uploads/${id}/content`, f.people.admin)).status).toBe(404);
    expect((await f.call('/uploads/abc/content', f.people.author)).status).toBe(400);
  });
});
