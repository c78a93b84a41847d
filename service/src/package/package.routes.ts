import { Router } from 'express';
import { z } from 'zod';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { idParam, parse } from '../http/validate.js';
import { compareResults } from './compare.js';
import { attachment } from './content-disposition.js';
import {
  packageFormats,
  type MadePackage,
  type PackageComparison,
  type PackageFormat,
  type PackageRevision,
} from '../../../contract/package.js';
import { getRevision, listRevisions, type PackageRevisionSummary } from './package.repository.js';
import { contentTypes, makePackage } from './package.service.js';
import type { FileStorage } from './storage.js';

const compareQuery = z.object({ from: z.string().max(64), to: z.string().max(64) });

function fileUrl(projectId: string, revisionId: string, format: PackageFormat): string {
  return `/api/projects/${projectId}/packages/${revisionId}/files/${format}`;
}

function listed(projectId: string, revision: PackageRevisionSummary): PackageRevision {
  return {
    id: revision.id,
    revision: revision.number,
    draft: revision.draft,
    designRevision: revision.designRevision,
    fingerprint: revision.fingerprint,
    madeAt: revision.madeAt,
    madeBy: revision.madeBy,
    files: revision.files.map((file) => ({
      format: file.format,
      size: file.size,
      sha256: file.sha256,
      url: fileUrl(projectId, revision.id, file.format),
    })),
  };
}

/**
 * Submittal packages, under /api/projects/:projectId: engineers make them; every member lists and
 * downloads them, except that the contractor sees only final packages (of accepted or issued
 * designs), never drafts.
 */
export function packageRouter(db: Database, storage: FileStorage, settings: { appUrl: string; mailQueued: () => void }): Router {
  const router = Router({ mergeParams: true });
  router.use('/packages', requireProjectAction('export'));

  /** Whether the caller may see a revision: drafts are the design team's, not the contractor's. */
  const mayOpen = (role: string | null, isAdmin: boolean, draft: boolean) => isAdmin || !draft || role !== 'contractor';

  router.get('/packages', async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const { user } = currentSession(req);
    const revisions = (await listRevisions(db, projectId)).filter((revision) => mayOpen(role, user.isAdmin, revision.draft));
    res.json({ revisions: revisions.map((revision) => listed(projectId, revision)) });
  });

  router.post('/packages', async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const { user } = currentSession(req);
    if (!user.isAdmin && role !== 'engineer') throw AppError.forbidden('Only the engineer may make a submittal package.');
    const made = await makePackage(
      db,
      storage,
      projectId,
      { userId: user.id, name: user.name, role, isAdmin: user.isAdmin },
      { appUrl: settings.appUrl },
    );
    // Making the final package of an accepted design issues it, and the mail is queued with it.
    settings.mailQueued();
    res.status(201).json({
      id: made.id,
      revision: made.number,
      draft: made.draft,
      fingerprint: made.fingerprint,
      files: made.files.map((file) => ({ format: file.format, url: fileUrl(projectId, made.id, file.format) })),
    } satisfies MadePackage);
  });

  router.get('/packages/compare', async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const { user } = currentSession(req);
    const query = parse(compareQuery, req.query);
    const [from, to] = await Promise.all(
      [query.from, query.to].map(async (id) => {
        const revision = await getRevision(db, projectId, idParam(id, 'That package revision'));
        if (!revision || !mayOpen(role, user.isAdmin, revision.draft)) throw AppError.notFound('That package revision does not exist.');
        return revision;
      }),
    );
    res.json({
      from: { id: from!.id, revision: from!.number, draft: from!.draft, fingerprint: from!.fingerprint },
      to: { id: to!.id, revision: to!.number, draft: to!.draft, fingerprint: to!.fingerprint },
      ...compareResults(from!.result, to!.result),
    } satisfies PackageComparison);
  });

  router.get('/packages/:revisionId/files/:format', async (req, res) => {
    const { projectId, role, project } = projectAccess(req);
    const { user } = currentSession(req);
    const format = packageFormats.find((candidate) => candidate === req.params['format']);
    const revision = await getRevision(db, projectId, idParam(req.params['revisionId'], 'That package revision'));
    const file = revision?.files.find((candidate) => candidate.format === format);
    if (!revision || !file || !format) throw AppError.notFound('That package file does not exist.');
    if (!mayOpen(role, user.isAdmin, revision.draft)) {
      throw AppError.forbidden(
        'Draft packages are for the design team; the contractor receives the final package once the design is accepted.',
      );
    }
    const body = await storage.get(file.key);
    res.setHeader('Content-Type', contentTypes[format]);
    res.setHeader('Content-Length', String(body.length));
    res.setHeader(
      'Content-Disposition',
      attachment(`${project.name} - submittal revision ${revision.number}${revision.draft ? ' (draft)' : ''}.${format}`),
    );
    res.send(body);
  });

  return router;
}
