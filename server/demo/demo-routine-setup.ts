import { matrixSetInputSchema } from '@shared/api/matrix-sets.ts';
import { createRoutineSchema } from '@shared/api/routines.ts';
import type { Db } from '@server/db/client.ts';
import { createMatrixSet } from '@server/matrix-sets/matrix-sets.service.ts';
import { createRoutine } from '@server/routines/routines.service.ts';
import { storeUpload } from '@server/uploads/uploads.service.ts';
import { person, type DemoPeople } from './demo-people.ts';
import { demoRoutines, type DemoRoutineKey } from './demo-routines.ts';
import { demoTeam } from './demo-team.ts';
import { stiffnessFile, stiffnessModels } from './frame-models.ts';

/**
 * Stores the frame stiffness matrices through the uploads service (which parses them and keeps
 * their size, entry count and symmetry), as the maintainer would upload them. Returns their ids.
 */
export async function uploadStiffnessMatrices(db: Db, people: DemoPeople): Promise<number[]> {
  const maintainer = person(people, demoTeam.maintainer);
  const ids: number[] = [];
  for (const model of stiffnessModels) {
    const file = stiffnessFile(model);
    const upload = await storeUpload(db, maintainer, people.teamId, {
      fileName: file.fileName,
      bytes: new TextEncoder().encode(file.text),
    });
    ids.push(upload.id);
  }
  return ids;
}

/** Creates each routine's matrix set and the routine on it, as the maintainer; ids by key. */
export async function createDemoRoutines(
  db: Db,
  people: DemoPeople,
  uploadIds: readonly number[],
): Promise<Map<DemoRoutineKey, number>> {
  const maintainer = person(people, demoTeam.maintainer);
  const ids = new Map<DemoRoutineKey, number>();
  for (const routine of demoRoutines) {
    const uploads = routine.set.withStiffnessUploads
      ? uploadIds.map((uploadId) => ({ kind: 'upload' as const, uploadId }))
      : [];
    const set = await createMatrixSet(
      db,
      maintainer,
      people.teamId,
      matrixSetInputSchema.parse({
        name: routine.set.name,
        description: routine.set.description,
        timingSizes: routine.set.timingSizes,
        items: [...routine.set.items, ...uploads],
      }),
    );
    const created = await createRoutine(
      db,
      maintainer,
      people.teamId,
      createRoutineSchema.parse({
        slug: routine.slug,
        title: routine.title,
        description: routine.description,
        contract: routine.contract,
        policy: routine.policy,
        matrixSetId: set.id,
      }),
    );
    ids.set(routine.key, created.id);
  }
  return ids;
}
