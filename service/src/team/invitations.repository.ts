import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import type { InvitationRow, ProjectRole, UserRow } from '../db/tables.js';
import { recordAudit } from '../audit/audit.repository.js';
import { hashToken } from '../auth/password.repository.js';
import { lockProject } from '../db/project-lock.js';
import { Conflict, NotFound } from '../domain-errors.js';
import type { InvitationPreview, InvitationView } from '../../../contract/accounts.js';

/** Where an invitation stands, for the one who holds its link. */
export type InvitationState = 'open' | 'expired' | 'accepted' | 'withdrawn';

interface ListedRow {
  id: string;
  email: string;
  role: ProjectRole;
  inviter: string | null;
  created_at: Date;
  expires_at: Date;
  expired: boolean;
}

const toView = (row: ListedRow): InvitationView => ({
  id: row.id,
  email: row.email,
  role: row.role,
  invitedBy: row.inviter,
  createdAt: row.created_at.toISOString(),
  expiresAt: row.expires_at.toISOString(),
  expired: row.expired,
});

/** The project's invitations neither accepted nor withdrawn, expired ones included (marked), newest first. */
export async function listInvitations(db: Database | Knex.Transaction, projectId: string): Promise<InvitationView[]> {
  const rows = await db('invitations as i')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.project_id', projectId)
    .whereNull('i.accepted_at')
    .whereNull('i.withdrawn_at')
    .orderBy([
      { column: 'i.created_at', order: 'desc' },
      { column: 'i.id', order: 'desc' },
    ])
    .select<ListedRow[]>(
      'i.id',
      'i.email',
      'i.role',
      'u.name as inviter',
      'i.created_at',
      'i.expires_at',
      db.raw('i.expires_at <= now() as expired'),
    );
  return rows.map(toView);
}

export type InviteResult =
  | { outcome: 'invited'; invitation: InvitationView; token: string; projectName: string; inviter: string }
  | { outcome: 'added'; user: Pick<UserRow, 'id' | 'name' | 'email'>; projectName: string; inviter: string };

/**
 * Invites an address to the project's team, in the caller's transaction, under the project's lock.
 * An address with an account is added to the team at once (an engineer inviting a colleague wants
 * them on the team; the invitation link would only make them sign in); one already on the team is
 * refused, since its role is changed with the team form. An address with no account gets a new
 * single-use token, good for `days`; one with a live invitation is refused, and an expired one is
 * ended by the new one.
 */
export async function invite(
  trx: Knex.Transaction,
  projectId: string,
  input: { email: string; role: ProjectRole; actorId: string; days: number },
): Promise<InviteResult> {
  await lockProject(trx, projectId, { allowArchived: true, anyState: true });
  const project = (await trx('projects').where({ id: projectId }).first<{ name: string }>('name'))!;
  const inviter = (await trx('users').where({ id: input.actorId }).first('name'))?.name ?? 'Someone';
  const user = await trx('users').whereRaw('lower(email) = lower(?)', [input.email]).first();
  if (user) {
    const member = await trx('project_members').where({ project_id: projectId, user_id: user.id }).first('role');
    if (member) {
      throw new Conflict(`${user.name} is on the team already, as ${member.role}. Change a member's role with the team form.`, [
        { path: 'email', message: 'Already on the team.' },
      ]);
    }
    await trx('project_members').insert({ project_id: projectId, user_id: user.id, role: input.role });
    await recordAudit(trx, {
      userId: input.actorId,
      projectId,
      action: 'add-member',
      entity: 'project_member',
      entityId: user.id,
      detail: { name: user.email, before: null, after: { role: input.role } },
    });
    return { outcome: 'added', user, projectName: project.name, inviter };
  }

  const open = await trx('invitations')
    .where({ project_id: projectId })
    .whereRaw('lower(email) = lower(?)', [input.email])
    .whereNull('accepted_at')
    .whereNull('withdrawn_at')
    .select<(InvitationRow & { expired: boolean })[]>('*', trx.raw('expires_at <= now() as expired'));
  if (open.some((row) => !row.expired)) {
    throw new Conflict('This address has an invitation waiting already. Withdraw it first to send a new one.', [
      { path: 'email', message: 'Invited already.' },
    ]);
  }
  // An expired invitation stays listed until something ends it: the new one does.
  if (open.length > 0) {
    await trx('invitations')
      .whereIn(
        'id',
        open.map((row) => row.id),
      )
      .update({ withdrawn_at: trx.fn.now(), withdrawn_by: input.actorId });
  }
  const token = randomBytes(32).toString('base64url');
  const [row] = await trx('invitations')
    .insert({
      project_id: projectId,
      email: input.email,
      role: input.role,
      token_hash: hashToken(token),
      invited_by: input.actorId,
      expires_at: new Date(Date.now() + input.days * 86_400_000),
    })
    .returning('*');
  const created = row as InvitationRow;
  await recordAudit(trx, {
    userId: input.actorId,
    projectId,
    action: 'invite',
    entity: 'invitation',
    entityId: created.id,
    detail: { name: created.email, after: { role: created.role, expiresAt: created.expires_at.toISOString() } },
  });
  return {
    outcome: 'invited',
    token,
    projectName: project.name,
    inviter,
    invitation: toView({ ...created, inviter, expired: false }),
  };
}

/** Ends an invitation nobody accepted yet; its link stops working. */
export async function withdrawInvitation(
  db: Database,
  projectId: string,
  invitationId: string,
  actorId: string,
): Promise<InvitationView[]> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId, { allowArchived: true, anyState: true });
    const row = await trx('invitations').where({ id: invitationId, project_id: projectId }).forUpdate().first();
    if (!row) throw new NotFound('No such invitation on this project.');
    if (row.accepted_at) throw new Conflict(`${row.email} accepted this invitation already: they are on the team.`);
    if (!row.withdrawn_at) {
      await trx('invitations').where({ id: invitationId }).update({ withdrawn_at: trx.fn.now(), withdrawn_by: actorId });
      await recordAudit(trx, {
        userId: actorId,
        projectId,
        action: 'withdraw-invitation',
        entity: 'invitation',
        entityId: invitationId,
        detail: { name: row.email, before: { role: row.role } },
      });
    }
    return listInvitations(trx, projectId);
  });
}

interface TokenRow extends InvitationRow {
  project_name: string;
  inviter: string | null;
  expired: boolean;
}

function stateOf(row: TokenRow): InvitationState {
  if (row.accepted_at) return 'accepted';
  if (row.withdrawn_at) return 'withdrawn';
  return row.expired ? 'expired' : 'open';
}

function tokenQuery(db: Database | Knex.Transaction, token: string) {
  return db('invitations as i')
    .join('projects as p', 'p.id', 'i.project_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.token_hash', hashToken(token))
    .select('i.*', 'p.name as project_name', 'u.name as inviter', db.raw('i.expires_at <= now() as expired'));
}

/** The invitation a link's token names and where it stands; null for a token nobody was sent. */
export async function findInvitation(db: Database, token: string): Promise<{ state: InvitationState; preview: InvitationPreview } | null> {
  const row = await tokenQuery(db, token).first<TokenRow | undefined>();
  if (!row) return null;
  return {
    state: stateOf(row),
    preview: {
      email: row.email,
      role: row.role,
      projectName: row.project_name,
      invitedBy: row.inviter,
      expiresAt: row.expires_at.toISOString(),
    },
  };
}

export type AcceptResult =
  | { accepted: true; user: UserRow; projectId: string }
  | { accepted: false; state: Exclude<InvitationState, 'open'> | 'unknown' | 'account-exists' };

/**
 * Uses up an open invitation: the account (with the password hash given), the membership and the
 * record of both, in the caller's transaction. The row is read under the project's lock, so two tabs
 * accepting the same link make one account.
 */
export async function acceptInvitation(
  trx: Knex.Transaction,
  token: string,
  account: { name: string; passwordHash: string },
): Promise<AcceptResult> {
  const named = await tokenQuery(trx, token).first<TokenRow | undefined>();
  if (!named) return { accepted: false, state: 'unknown' };
  // The project's lock first, as a withdrawal takes it, then the row read again under it.
  await lockProject(trx, named.project_id, { allowArchived: true, anyState: true });
  const found = (await tokenQuery(trx, token).forUpdate('i').first<TokenRow | undefined>())!;
  const state = stateOf(found);
  if (state !== 'open') return { accepted: false, state };
  // An administrator may have made the address an account since the invitation was sent.
  if (await trx('users').whereRaw('lower(email) = lower(?)', [found.email]).first('id'))
    return { accepted: false, state: 'account-exists' };
  const [created] = await trx('users')
    .insert({ email: found.email, name: account.name, password_hash: account.passwordHash })
    .returning('*');
  const user = created as UserRow;
  await trx('project_members').insert({ project_id: found.project_id, user_id: user.id, role: found.role });
  await trx('invitations').where({ id: found.id }).update({ accepted_at: trx.fn.now(), accepted_user_id: user.id });
  await recordAudit(trx, {
    userId: user.id,
    projectId: found.project_id,
    action: 'accept-invitation',
    entity: 'invitation',
    entityId: found.id,
    detail: { name: found.email, accountName: user.name, after: { role: found.role }, invitedBy: found.invited_by },
  });
  return { accepted: true, user, projectId: found.project_id };
}
