import express, { type RequestHandler, type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { matrixMarketFile, type ReceivedFile } from './matrix-market-file.ts';
import {
  checkMayUpload,
  listUploads,
  previewUpload,
  storeUpload,
  uploadContent,
} from './uploads.service.ts';

/** Matrix Market uploads: store, preview (maintainers); list, read content (members). */
export function uploadsRouter(db: Db): Router {
  const router = express.Router();

  const mayUpload: RequestHandler = async (req, _res, next) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    await checkMayUpload(db, user, teamId);
    next();
  };

  router.post('/teams/:teamId/uploads/preview', mayUpload, matrixMarketFile, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await previewUpload(db, user, teamId, res.locals.file as ReceivedFile));
  });

  router.post('/teams/:teamId/uploads', mayUpload, matrixMarketFile, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.status(201).json(await storeUpload(db, user, teamId, res.locals.file as ReceivedFile));
  });

  router.get('/teams/:teamId/uploads', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await listUploads(db, user, teamId, paginationQuerySchema.parse(req.query)));
  });

  router.get('/uploads/:id/content', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const { fileName, content } = await uploadContent(db, user, id);
    res
      .type('text/plain; charset=utf-8')
      .set('content-disposition', `inline; filename*=UTF-8''${encodeURIComponent(fileName)}`)
      .set('x-content-type-options', 'nosniff')
      .send(content);
  });

  return router;
}
