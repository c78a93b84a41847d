import type { RequestHandler } from 'express';
import type { Database } from '../db/database.js';
import type { ProjectRole } from '../db/tables.js';
import { projectForMember, type ProjectForAccess } from '../projects/projects.repository.js';
import { AppError } from './app-error.js';
import { currentSession } from './session.js';
import { isUuid } from './validate.js';

/** What a person can do inside a project; each route names the action it performs. */
export type ProjectAction =
  'read' | 'edit-design' | 'submit' | 'review' | 'discuss-review' | 'export' | 'record-field-tests' | 'manage-team' | 'archive';

const allowedRoles: Record<ProjectAction, readonly ProjectRole[]> = {
  read: ['engineer', 'reviewer', 'contractor'],
  'edit-design': ['engineer'],
  submit: ['engineer'],
  review: ['reviewer'],
  /** Replies in a check item's thread: the engineer answers the reviewer. */
  'discuss-review': ['engineer', 'reviewer'],
  export: ['engineer', 'reviewer', 'contractor'],
  'record-field-tests': ['contractor'],
  'manage-team': ['engineer'],
  archive: ['engineer'],
};

export function roleMay(role: ProjectRole | null, isAdmin: boolean, action: ProjectAction): boolean {
  if (isAdmin) return true;
  return role !== null && allowedRoles[action].includes(role);
}

/** The project a request under `/projects/:projectId` names, and the caller's place on it, loaded once. */
export interface ProjectAccess {
  projectId: string;
  /** The caller's role on the project; null for an administrator who is not a member. */
  role: ProjectRole | null;
  project: ProjectForAccess;
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Set by {@link loadProject} for every request under `/projects/:projectId`. */
    projectAccess?: ProjectAccess;
  }
}

/**
 * Mounted once at `/projects/:projectId`: loads the project and the caller's membership for every
 * route below it, in one query, and puts them on the request. 404 for a project that does not exist
 * (an id that is not a UUID names none). Which action a route allows is checked by
 * {@link requireProjectAction}, which reads what this loaded.
 */
export function loadProject(db: Database): RequestHandler {
  return async (req, _res, next) => {
    const { user } = currentSession(req);
    const projectId = String(req.params['projectId'] ?? '');
    if (!isUuid(projectId)) {
      throw AppError.notFound('No such project.');
    }
    const found = await projectForMember(db, projectId, user.id);
    if (!found) {
      throw AppError.notFound('No such project.');
    }
    req.projectAccess = { projectId, role: found.role, project: found.project };
    next();
  };
}

/** The project the request names, as {@link loadProject} loaded it. */
export function projectAccess(req: { projectAccess?: ProjectAccess }): ProjectAccess {
  if (!req.projectAccess) throw new Error('The project was not loaded: the route is not under /projects/:projectId.');
  return req.projectAccess;
}

/**
 * Guards a route under `/projects/:projectId`: 404 for a non-member, as for a project that does not
 * exist (so an outsider learns nothing of it, not even that it exists), 403 for a member whose role
 * may not perform the action. Admin passes.
 */
export function requireProjectAction(action: ProjectAction): RequestHandler {
  return (req, _res, next) => {
    const { user } = currentSession(req);
    const { role } = projectAccess(req);
    if (!user.isAdmin && role === null) {
      throw AppError.notFound('No such project.');
    }
    if (!roleMay(role, user.isAdmin, action)) {
      throw AppError.forbidden(`Your role on this project (${role}) may not do this.`);
    }
    next();
  };
}
