import express, { type Router } from 'express';
import { idParamsSchema } from '@shared/api/params.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { streamTrialEvents } from './trial-event-stream.ts';
import { exportTrialCsv, getTrialJson, openTrialEvents, TrialJsonCache } from './trials.service.ts';

/** Trials: the full report, its per-matrix table as CSV, and live progress as server-sent events. */
export function trialsRouter(db: Db): Router {
  const router = express.Router();
  const reports = new TrialJsonCache();

  // Non-finite metrics (a kernel's garbage, a singular matrix's κ) travel as strings.
  router.get('/trials/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.type('application/json').send(await getTrialJson(db, user, id, reports));
  });

  router.get('/trials/:id/export.csv', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const { fileName, csv } = await exportTrialCsv(db, user, id);
    res.attachment(fileName).type('text/csv; charset=utf-8').send(csv);
  });

  router.get('/trials/:id/events', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    await streamTrialEvents(res, await openTrialEvents(db, user, id));
  });

  return router;
}
