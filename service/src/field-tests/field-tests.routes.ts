import express, { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { loadEditionData } from '../code-tables/code-tables.repository.js';
import { boundedDecimal, textField } from '../compliance/bounds.js';
import { evaluate, validateDocument } from '../compliance/index.js';
import type { Database } from '../db/database.js';
import { projectDocument } from '../design/project-document.js';
import { NotFound, Refused } from '../domain-errors.js';
import { designChangedAt, keepFieldTestSummary } from '../projects/projects.repository.js';
import { notComputedMessage } from '../evaluation/evaluation.service.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { AppError } from '../http/app-error.js';
import { idParam, parse } from '../http/validate.js';
import { attachment } from '../package/content-disposition.js';
import { packageCautions } from '../package/package-words.js';
import type { FileStorage } from '../package/storage.js';
import { fieldTestRecordDocx, recordPhotoLimit } from './field-test-record.js';
import {
  testKindLabels,
  testKinds,
  type FieldTestRecord,
  fieldTestSummaryOf,
  type KindProgress,
  type RecordedFieldTest,
  type TestKind,
  type TestPlanGroup,
  type TestPlanItemView,
  type TestPlanView,
  photoCaptionMax,
  photoMaxBytes,
} from '../../../contract/field-tests.js';
import { scheduleSettings } from '../exterior-schedule/schedule-settings.repository.js';
import { addPhoto, displayCopies, listPhotos, readPhoto, removePhoto, type PhotoSize } from './field-test-photos.js';
import { listFieldTests, recordFieldTest } from './field-tests.repository.js';
import { buildTestPlan } from './test-plan.js';

/** A measured value: a number (or decimal text) within its range, at most two decimal places. */
const measuredValue = (what: string, max: string) =>
  z
    .custom<string | number>((value) => typeof value === 'string' || typeof value === 'number', {
      message: `Give the ${what} as a number.`,
    })
    .transform((value, ctx) => {
      const checked = boundedDecimal(value, { min: 'zero', max });
      if (!checked.ok) {
        ctx.addIssue({ code: 'custom', message: `The ${what}: ${checked.message}` });
        return z.NEVER;
      }
      if (/\.\d{3,}$/.test(checked.value)) {
        ctx.addIssue({ code: 'custom', message: `Give the ${what} with at most two decimal places.` });
        return z.NEVER;
      }
      return checked.value;
    });

export const fieldTestSchema = z.strictObject({
  result: z.enum(['pass', 'fail'], { error: 'Choose pass or fail.' }),
  measured: z
    .strictObject({
      timeoutMinutes: measuredValue('time-out in minutes', '1440').optional(),
      lightLevel: measuredValue('light level', '100000').optional(),
      overrideMinutes: measuredValue('override time in minutes', '1440').optional(),
    })
    .optional(),
  notes: textField(2000, { multiline: true }).optional(),
});

/** A plan item's key as the plan makes it: the kind, the strategy, a space id or application key, maybe a room. */
const itemIdSchema = z
  .string()
  .max(300)
  .regex(/^[a-z-]+:[a-z-]+:[A-Za-z0-9._-]+(:\d{1,6})?$/);

const photoTooLarge = () =>
  new AppError(413, 'payload_too_large', 'This photo is larger than 10 MB. Take it at a smaller size, or choose a smaller file.');

/**
 * A photo's bytes as they arrive (JPEG or PNG), at most 10 MB: a declared length over that is
 * refused before anything is read, and a body that turns out longer is cut off at the limit.
 */
const photoBody: RequestHandler[] = [
  (req, _res, next) => {
    const declared = Number(req.get('content-length') ?? '0');
    if (Number.isFinite(declared) && declared > photoMaxBytes) throw photoTooLarge();
    if (!req.is(['image/jpeg', 'image/png'])) throw AppError.badRequest('Send the photo as a JPEG or PNG image.');
    next();
  },
  (req, res, next) =>
    express.raw({ type: ['image/jpeg', 'image/png'], limit: photoMaxBytes })(req, res, (error?: unknown) => {
      if (error && (error as { status?: number }).status === 413) return next(photoTooLarge());
      next(error);
    }),
];

const captionSchema = z.strictObject({ caption: textField(photoCaptionMax).optional() });
const sizeSchema = z.enum(['thumb', 'display', 'original'], { error: 'Ask for the thumb, display or original size.' });

function progressOf(items: readonly TestPlanItemView[], kind?: TestKind): Omit<KindProgress, 'kind' | 'label'> {
  const required = items.filter((item) => item.required && (kind === undefined || item.kind === kind));
  const passed = required.filter((item) => item.result?.result === 'pass').length;
  const failed = required.filter((item) => item.result?.result === 'fail').length;
  return { required: required.length, passed, failed, untested: required.length - passed - failed };
}

/** The plan of the project as its design now is, with the results recorded so far attached by item id. */
async function planView(db: Database, projectId: string): Promise<TestPlanView> {
  return (await planContext(db, projectId)).view;
}

/** The plan view with the evaluation it was made from and the edition's title. */
async function planContext(db: Database, projectId: string) {
  const designAt = await designChangedAt(db, projectId);
  const input = await projectDocument(db, projectId);
  const tables = await loadEditionData(db, input.edition);
  if (!tables) throw new Refused('The project’s code edition is not loaded.');
  const outcome = validateDocument(input, tables);
  if (!outcome.valid) throw new Refused(notComputedMessage, outcome.problems);
  const result = evaluate(outcome.document, tables);
  const [records, schedule, photos] = await Promise.all([
    listFieldTests(db, projectId),
    scheduleSettings(db, projectId),
    listPhotos(db, projectId),
  ]);
  const plan = buildTestPlan(projectId, outcome.document, result, records, schedule.settings);
  const byItem = new Map<string, FieldTestRecord[]>();
  for (const record of records) byItem.set(record.itemId, [...(byItem.get(record.itemId) ?? []), record]);
  const items: TestPlanItemView[] = plan.items.map((item) => {
    const history = byItem.get(item.id) ?? [];
    const latest = history[history.length - 1];
    return { ...item, ...(latest ? { result: latest } : {}), history, photos: photos.get(item.id) ?? [] };
  });
  const kinds = testKinds.filter((kind) => items.some((item) => item.kind === kind));
  const overall = progressOf(items);
  const progress = {
    ...overall,
    complete: overall.required > 0 && overall.passed === overall.required,
    kinds: kinds.map((kind) => ({ kind, label: testKindLabels[kind], ...progressOf(items, kind) })),
  };
  const notices = [...plan.groups.filter((group) => group.widened).map((group) => group.words), ...plan.gaps];
  const view: TestPlanView = { items, groups: plan.groups, gaps: plan.gaps, notices, progress };
  if (designAt) await keepFieldTestSummary(db, projectId, designAt, fieldTestSummaryOf(view));
  return { view, result, edition: tables.title };
}

/**
 * Makes the project's plan again when tests have been recorded, so the project read says where
 * testing stands as the design now is (a project with no recorded test says nothing). A design
 * that cannot be evaluated leaves the summary unset: the Field tests page says why.
 */
export async function refreshFieldTestSummary(db: Database, projectId: string): Promise<void> {
  const recorded = await db('field_test_results').where({ project_id: projectId }).first('id');
  if (!recorded) return;
  try {
    await planContext(db, projectId);
  } catch (error) {
    if (!(error instanceof Refused)) throw error;
  }
}

/**
 * The functional test plan, under /api/projects/:projectId: `GET /test-plan` (members; made from
 * the current design on each read, the recorded results attached) and `PATCH
 * /test-plan/items/:itemId` (the contractor records a test: pass or fail, measured values, notes;
 * a retest adds to the item's history).
 */
export function fieldTestsRouter(db: Database, storage: FileStorage): Router {
  const router = Router({ mergeParams: true });

  router.get('/test-plan', requireProjectAction('read'), async (req, res) => {
    res.json(await planView(db, projectAccess(req).projectId));
  });

  router.patch('/test-plan/items/:itemId', requireProjectAction('record-field-tests'), async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const parsedId = itemIdSchema.safeParse(req.params['itemId']);
    if (!parsedId.success) throw new NotFound('That test item is not in the plan.');
    const input = parse(fieldTestSchema, req.body);
    const before = await planView(db, projectId);
    const item = before.items.find((entry) => entry.id === parsedId.data);
    if (!item) throw new NotFound('That test item is not in the plan.');
    const measured = Object.fromEntries(Object.entries(input.measured ?? {}).filter(([, value]) => value !== undefined));
    await recordFieldTest(
      db,
      projectId,
      item,
      { result: input.result, measured, ...(input.notes ? { notes: input.notes } : {}) },
      { userId: currentSession(req).user.id, role, retest: item.history.length > 0 },
    );
    const after = await planView(db, projectId);
    const updated = after.items.find((entry) => entry.id === item.id)!;
    const group: TestPlanGroup | undefined = after.groups.find((entry) => entry.itemIds.includes(item.id));
    const answer: RecordedFieldTest = { item: updated, ...(group ? { group } : {}), notices: after.notices, progress: after.progress };
    res.json(answer);
  });

  router.post('/test-plan/items/:itemId/photos', requireProjectAction('record-field-tests'), ...photoBody, async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const parsedId = itemIdSchema.safeParse(req.params['itemId']);
    if (!parsedId.success) throw new NotFound('That test item is not in the plan.');
    const { caption } = parse(captionSchema, req.query);
    if (!Buffer.isBuffer(req.body) || req.body.length === 0) throw AppError.badRequest('Send the photo as a JPEG or PNG image.');
    const plan = await planView(db, projectId);
    const item = plan.items.find((entry) => entry.id === parsedId.data);
    if (!item) throw new NotFound('That test item is not in the plan.');
    const added = await addPhoto(
      db,
      storage,
      projectId,
      { id: item.id, title: item.title, latestResultId: item.result?.id ?? null },
      { body: req.body, ...(caption ? { caption } : {}) },
      { userId: currentSession(req).user.id, role },
    );
    res.status(201).json(added);
  });

  router.get('/test-plan/items/:itemId/photos/:photoId', requireProjectAction('read'), async (req, res) => {
    const { projectId } = projectAccess(req);
    const itemId = itemIdSchema.safeParse(req.params['itemId']);
    if (!itemId.success) throw new NotFound('That photo does not exist.');
    const photoId = idParam(req.params['photoId'], 'That photo');
    const size: PhotoSize = parse(z.object({ size: sizeSchema.default('display') }), req.query).size;
    const file = await readPhoto(db, storage, projectId, { itemId: itemId.data, photoId }, size);
    res.set('Content-Type', file.contentType).set('Cache-Control', 'private, no-store').send(file.data);
  });

  router.delete('/test-plan/items/:itemId/photos/:photoId', requireProjectAction('record-field-tests'), async (req, res) => {
    const { projectId, role } = projectAccess(req);
    const itemId = itemIdSchema.safeParse(req.params['itemId']);
    if (!itemId.success) throw new NotFound('That photo does not exist.');
    const photoId = idParam(req.params['photoId'], 'That photo');
    const plan = await planView(db, projectId);
    const title = plan.items.find((item) => item.id === itemId.data)?.title ?? itemId.data;
    await removePhoto(db, storage, projectId, { id: itemId.data, title }, photoId, { userId: currentSession(req).user.id, role });
    res.status(204).end();
  });

  router.get('/test-plan/record', requireProjectAction('read'), async (req, res) => {
    const { projectId } = projectAccess(req);
    const context = await planContext(db, projectId);
    const project = await db('projects').where({ id: projectId }).first('name', 'address');
    const photos = await displayCopies(db, storage, projectId, recordPhotoLimit);
    const data = await fieldTestRecordDocx({
      project: { name: project!.name, address: project!.address, edition: context.edition },
      plan: context.view,
      cautions: packageCautions(context.result),
      photos,
      madeAt: new Date(),
    });
    res
      .set('Content-Type', 'application/vnd.openxmlformats-officedocument.wordprocessingml.document')
      .set('Content-Disposition', attachment(`${project!.name} - field test record.docx`))
      .send(data);
  });

  return router;
}
