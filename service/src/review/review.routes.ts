import { Router } from 'express';
import { z } from 'zod';
import { projectStates } from '../../../contract/review.js';
import { textField, versionField } from '../compliance/bounds.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { parse } from '../http/validate.js';
import { getProjectDetail } from '../projects/projects.repository.js';
import { applyTransition, NotYourMove, TransitionRefused } from './transitions.js';

const transitionSchema = z.object({
  to: z.enum(projectStates),
  version: versionField,
  comment: textField(2000, { multiline: true }).optional(),
});

export interface ReviewSettings {
  /** The address people reach the app at: the links in the review mail. */
  appUrl: string;
  /** Told once a move committed, so its mail goes out at once rather than at the next poll. */
  mailQueued: () => void;
}

/** The review state's moves, under /api/projects/:projectId. Each move checks its own role. */
export function reviewRouter(db: Database, settings: ReviewSettings): Router {
  const router = Router({ mergeParams: true });

  router.post('/transitions', requireProjectAction('read'), async (req, res) => {
    const input = parse(transitionSchema, req.body);
    const { projectId, role } = projectAccess(req);
    const { user } = currentSession(req);
    try {
      await applyTransition(
        db,
        projectId,
        { ...input, comment: input.comment ?? undefined },
        { userId: user.id, role, isAdmin: user.isAdmin },
        { appUrl: settings.appUrl },
      );
    } catch (error) {
      if (error instanceof NotYourMove) throw AppError.forbidden(error.message);
      if (error instanceof TransitionRefused) {
        throw AppError.conflict(error.message, [
          { path: 'state', message: error.state },
          { path: 'version', message: String(error.version) },
        ]);
      }
      throw error;
    }
    settings.mailQueued();
    res.json(await getProjectDetail(db, projectId, role));
  });

  return router;
}
