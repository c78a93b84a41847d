import express, { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { cutSheetMaxBytes } from '../../../contract/cut-sheets.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { idParam, parse } from '../http/validate.js';
import { attachment } from '../package/content-disposition.js';
import type { FileStorage } from '../package/storage.js';
import { getCutSheet, listCutSheets } from './cut-sheets.repository.js';
import { attachCutSheet, cutSheetView, removeCutSheet } from './cut-sheets.service.js';

const tooLargeWords = 'The cut sheet is larger than 20 MB. Send a smaller PDF (a cut sheet is usually a few pages).';

const uploadQuery = z.object({ name: z.string().max(1000).optional() });

/** The body, read only up to 20 MB: a declared length over it is refused before a byte is read, and so is a longer stream. */
function pdfBody(): RequestHandler {
  const raw = express.raw({ type: () => true, limit: cutSheetMaxBytes });
  return (req, res, next) => {
    const declared = Number(req.get('content-length'));
    if (Number.isFinite(declared) && declared > cutSheetMaxBytes) throw new AppError(413, 'payload_too_large', tooLargeWords);
    raw(req, res, (error?: unknown) => {
      const status = (error as { status?: unknown } | undefined)?.status;
      next(status === 413 ? new AppError(413, 'payload_too_large', tooLargeWords) : error);
    });
  };
}

/**
 * The cut sheets of a project's luminaire types, under /api/projects/:projectId: every member lists
 * and downloads them; the roles that edit the design attach, replace and remove them.
 */
export function cutSheetsRouter(db: Database, storage: FileStorage): Router {
  const router = Router({ mergeParams: true });
  const read = requireProjectAction('read');
  const edit = requireProjectAction('edit-design');
  const typeId = (value: string | string[] | undefined) => idParam(value, 'This luminaire type');

  router.get('/cut-sheets', read, async (req, res) => {
    const { projectId } = projectAccess(req);
    res.json((await listCutSheets(db, projectId)).map((row) => cutSheetView(projectId, row)));
  });

  router.put('/luminaire-types/:typeId/cut-sheet', edit, pdfBody(), async (req, res) => {
    const { projectId } = projectAccess(req);
    const { name } = parse(uploadQuery, req.query);
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    res.json(await attachCutSheet(db, storage, projectId, typeId(req.params['typeId']), body, name, currentSession(req).user.id));
  });

  router.get('/luminaire-types/:typeId/cut-sheet', read, async (req, res) => {
    const { projectId } = projectAccess(req);
    const row = await getCutSheet(db, projectId, typeId(req.params['typeId']));
    if (!row) throw AppError.notFound('This luminaire type has no cut sheet on file.');
    const body = await storage.get(row.storage_key);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Length', String(body.length));
    res.setHeader('Content-Disposition', attachment(row.file_name));
    res.send(body);
  });

  router.delete('/luminaire-types/:typeId/cut-sheet', edit, async (req, res) => {
    const { projectId } = projectAccess(req);
    await removeCutSheet(db, storage, projectId, typeId(req.params['typeId']), currentSession(req).user.id);
    res.status(204).end();
  });

  return router;
}
