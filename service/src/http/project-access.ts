import type { RequestHandler } from 'express';
import type { Database } from '../db/database.js';
import type { ProjectRole } from '../db/tables.js';
import { projectMembership } from '../projects/projects.repository.js';
import { AppError } from './app-error.js';
import { currentSession } from './session.js';
import { isUuid } from './validate.js';

/** What a person can do inside a project; each route names the action it performs. */
export type ProjectAction = 'read' | 'edit-design' | 'submit' | 'review' | 'export' | 'record-field-tests' | 'manage-team' | 'archive';

const allowedRoles: Record<ProjectAction, readonly ProjectRole[]> = {
  read: ['engineer', 'reviewer', 'contractor'],
  'edit-design': ['engineer'],
  submit: ['engineer'],
  review: ['reviewer'],
  export: ['engineer', 'reviewer', 'contractor'],
  'record-field-tests': ['contractor'],
  'manage-team': ['engineer'],
  archive: ['engineer'],
};

export function roleMay(role: ProjectRole | null, isAdmin: boolean, action: ProjectAction): boolean {
  if (isAdmin) return true;
  return role !== null && allowedRoles[action].includes(role);
}

export interface ProjectAccess {
  projectId: string;
  role: ProjectRole | null;
}

declare module 'express-serve-static-core' {
  interface Request {
    projectAccess?: ProjectAccess;
  }
}

/**
 * Guards a route under `/projects/:projectId`: 404 for a project that does not exist,
 * 403 for a non-member or a member whose role may not perform the action. Admin passes.
 */
export function requireProjectAction(db: Database, action: ProjectAction): RequestHandler {
  return async (req, _res, next) => {
    const { user } = currentSession(req);
    const projectId = String(req.params['projectId'] ?? '');
    if (!isUuid(projectId)) {
      throw AppError.notFound('No such project.');
    }
    const { exists, role } = await projectMembership(db, projectId, user.id);
    if (!exists) {
      throw AppError.notFound('No such project.');
    }
    if (!user.isAdmin && role === null) {
      throw AppError.forbidden('You are not a member of this project.');
    }
    if (!roleMay(role, user.isAdmin, action)) {
      throw AppError.forbidden(`Your role on this project (${role}) may not do this.`);
    }
    req.projectAccess = { projectId, role };
    next();
  };
}
