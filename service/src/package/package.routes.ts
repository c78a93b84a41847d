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
  type PackageJob,
  type PackageJobAnswer,
  type PackageComparison,
  type PackageFormat,
  type PackageRevision,
} from '../../../contract/package.js';
import { getRevision, listRevisions, type PackageRevisionSummary } from './package.repository.js';
import { getPackageJob, type PackageJobRecord } from './package-jobs.repository.js';
import type { PackageJobs } from './package-jobs.js';
import { contentTypes, makePackage } from './package.service.js';
import type { FileStorage } from './storage.js';

const compareQuery = z.object({ from: z.string().max(64), to: z.string().max(64) });

function fileUrl(projectId: string, revisionId: string, format: PackageFormat): string {
  return `/api/projects/${projectId}/packages/${revisionId}/files/${format}`;
}

function madeAnswer(
  projectId: string,
  made: { id: string; number: number; draft: boolean; fingerprint: string; files: { format: PackageFormat }[] },
): MadePackage {
  return {
    id: made.id,
    revision: made.number,
    draft: made.draft,
    fingerprint: made.fingerprint,
    files: made.files.map((file) => ({ format: file.format, url: fileUrl(projectId, made.id, file.format) })),
  };
}

function jobAnswer(job: PackageJobRecord): PackageJobAnswer {
  const answer: PackageJob = { id: job.id, state: job.state, progress: job.progress, step: job.step };
  if (job.state === 'done' && job.made) answer.package = madeAnswer(job.projectId, job.made);
  if (job.state === 'failed') answer.error = job.error ?? 'The package could not be made.';
  return { job: answer };
}

export interface PackageRouteSettings {
  appUrl: string;
  mailQueued: () => void;
  /** The background jobs; without them every package is made at once. */
  jobs?: PackageJobs | undefined;
  /** Projects with at least this many spaces go to a background job. */
  jobMinSpaces: number;
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
export function packageRouter(db: Database, storage: FileStorage, settings: PackageRouteSettings): Router {
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
    const actor = { userId: user.id, name: user.name, role, isAdmin: user.isAdmin };
    if (settings.jobs && (await spaceCount(db, projectId)) >= settings.jobMinSpaces) {
      const job = await settings.jobs.request(projectId, actor);
      res.status(202).json(jobAnswer(job) satisfies PackageJobAnswer);
      return;
    }
    const made = await makePackage(db, storage, projectId, actor, { appUrl: settings.appUrl });
    // Making the final package of an accepted design issues it, and the mail is queued with it.
    settings.mailQueued();
    res.status(201).json(madeAnswer(projectId, made) satisfies MadePackage);
  });

  router.get('/packages/jobs/:jobId', async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const { user } = currentSession(req);
    if (!user.isAdmin && role !== 'engineer') throw AppError.forbidden('Only the engineer may follow the making of a submittal package.');
    const job = await getPackageJob(db, projectId, idParam(req.params['jobId'], 'That package job'));
    if (!job) throw AppError.notFound('That package job does not exist.');
    res.json(jobAnswer(job) satisfies PackageJobAnswer);
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

async function spaceCount(db: Database, projectId: string): Promise<number> {
  const row = await db('spaces').where({ project_id: projectId }).count<{ count: string }[]>('* as count').first();
  return Number(row?.count ?? 0);
}
