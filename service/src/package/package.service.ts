import { createHash, randomUUID } from 'node:crypto';
import type { PackageStep } from '../../../contract/package.js';
import type { ProjectState } from '../../../contract/review.js';
import { recordAudit } from '../audit/audit.repository.js';
import { loadEditionData } from '../code-tables/code-tables.repository.js';
import { evaluate, validateDocument } from '../compliance/index.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import type { PackageFileRecord, ProjectRole } from '../db/tables.js';
import { cutSheetNamesByTag } from '../design/cut-sheets.repository.js';
import { projectDocument } from '../design/project-document.js';
import { Conflict, Refused } from '../domain-errors.js';
import { notComputedMessage } from '../evaluation/evaluation.service.js';
import { getProjectDetail } from '../projects/projects.repository.js';
import { reviewRecord } from '../review/review-items.repository.js';
import type { TransitionMailSettings } from '../review/transition-mail.js';
import { applyTransition } from '../review/transitions.js';
import { buildCompliancePackage, buildComplianceWorkbook } from './builders.js';
import { resultFingerprint } from './fingerprint.js';
import type { PackageFormat, PackageInput, PackageRevisionStamp } from './package-input.js';
import { buildPackagePdf } from './package-pdf.js';
import { insertRevision, listRevisions, nextRevisionNumber } from './package.repository.js';
import type { FileStorage } from './storage.js';

export const contentTypes: Record<PackageFormat, string> = {
  docx: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  pdf: 'application/pdf',
};

/** A package is final when made of an accepted design (which it issues) or of an issued one; otherwise a draft. */
export function isFinalState(state: ProjectState): boolean {
  return state === 'accepted' || state === 'issued';
}

export interface MadePackage {
  id: string;
  number: number;
  draft: boolean;
  fingerprint: string;
  files: PackageFileRecord[];
}

/** Keys come from ids the service made, never from anything a person typed. */
function fileKey(projectId: string, revisionId: string, format: PackageFormat): string {
  return `projects/${projectId}/packages/${revisionId}/package.${format}`;
}

/**
 * Makes a submittal package of the project as it is stored: evaluates it, builds the Word, Excel
 * and PDF files, stores them, then records the revision (and, for an accepted design, issues it
 * through the review state machine) in one transaction. A failure before the record leaves no
 * revision; the state must still be the one the package was made for, or nothing is recorded.
 */
export async function makePackage(
  db: Database,
  storage: FileStorage,
  projectId: string,
  actor: { userId: string; name: string; role: ProjectRole | null; isAdmin: boolean },
  mail: TransitionMailSettings,
  /** Told as each step begins (a background job keeps its progress by it). */
  onStep: (step: PackageStep) => Promise<void> | void = () => {},
): Promise<MadePackage> {
  await onStep('evaluate');
  // One snapshot: the project, its design and its earlier revisions as of one moment, even while someone edits a draft.
  const { project, document, earlier, review, cutSheets } = await db.transaction(
    async (trx) => ({
      project: await getProjectDetail(trx, projectId, actor.role),
      document: await projectDocument(trx, projectId),
      cutSheets: await cutSheetNamesByTag(trx, projectId),
      earlier: await listRevisions(trx, projectId),
      review: await reviewRecord(trx, projectId),
    }),
    { isolationLevel: 'repeatable read', readOnly: true },
  );
  const state = project.state as ProjectState;
  const draft = !isFinalState(state);

  const tables = document.edition ? await loadEditionData(db, document.edition) : undefined;
  if (!tables) throw new Refused(notComputedMessage, [{ path: 'edition', message: 'No code edition is chosen.' }]);
  const outcome = validateDocument(document, tables);
  if (!outcome.valid) throw new Refused(notComputedMessage, outcome.problems);
  const result = evaluate(outcome.document, tables);
  const fingerprint = resultFingerprint(result);

  const history: PackageRevisionStamp[] = earlier.map((revision) => ({
    number: revision.number,
    fingerprint: revision.fingerprint,
    madeAt: revision.madeAt,
    madeBy: revision.madeBy ?? 'Someone no longer on the team',
    draft: revision.draft,
  }));
  const madeAt = new Date();
  // The number shown in the files; the record checks it again under the project's lock.
  const number = (earlier.at(-1)?.number ?? 0) + 1;
  const input: PackageInput = {
    project,
    document: outcome.document,
    result,
    revision: { number, fingerprint, madeAt: madeAt.toISOString(), madeBy: actor.name, draft },
    history,
    ...(review ? { review } : {}),
  };

  const id = randomUUID();
  const built: [PackageFormat, Buffer][] = [];
  await onStep('docx');
  built.push(['docx', await buildCompliancePackage(input, { cutSheets })]);
  await onStep('xlsx');
  built.push(['xlsx', await buildComplianceWorkbook(input, { cutSheets })]);
  await onStep('pdf');
  built.push(['pdf', await buildPackagePdf(input)]);
  await onStep('store');
  const files: PackageFileRecord[] = [];
  try {
    for (const [format, body] of built) {
      const key = fileKey(projectId, id, format);
      files.push({ format, key, size: body.length, sha256: createHash('sha256').update(body).digest('hex') });
      await storage.put(key, body, contentTypes[format]);
    }
    await db.transaction(async (trx) => {
      const locked = await lockProject(trx, projectId, { anyState: true });
      if (locked.version !== project.version || (await nextRevisionNumber(trx, projectId)) !== number) {
        throw new Conflict('The project changed while its package was being made. Make the package again.');
      }
      await insertRevision(trx, {
        id,
        projectId,
        number,
        draft,
        projectName: project.name,
        designRevision: project.revision,
        fingerprint,
        document,
        result,
        files,
        madeBy: actor.userId,
        madeAt,
      });
      await recordAudit(trx, {
        userId: actor.userId,
        projectId,
        action: 'create',
        entity: 'package',
        entityId: id,
        detail: { name: `Submittal revision ${number}`, package: { revision: number, draft, fingerprint } },
      });
      // Nested: a savepoint in this transaction, so the revision and the move commit together.
      if (state === 'accepted') {
        await applyTransition(trx, projectId, { to: 'issued', version: locked.version }, actor, mail);
      }
    });
  } catch (error) {
    // No revision names these files: they go, as far as the store lets them (a key left behind is never read).
    await Promise.allSettled(files.map((file) => storage.remove(file.key)));
    throw error;
  }
  return { id, number, draft, fingerprint, files };
}
