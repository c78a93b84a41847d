import { z } from 'zod';
import {
  projectStates,
  reviewItemKinds,
  reviewVerdicts,
  type ReviewBulkResult,
  type ReviewDeskEntry,
  type ReviewItem,
} from '../../../contract/review.js';
import { textField } from '../compliance/bounds.js';

/** Comments and replies: as long as a reviewer's paragraph, no longer. */
export const commentLimit = 2000;

/** Body of `PATCH /api/projects/:id/review-items/:itemId`; Needs revision says what needs revising. */
export const verdictSchema = z
  .object({
    verdict: z.enum(reviewVerdicts, { error: 'Choose Confirmed, Needs revision or Not applicable.' }),
    comment: textField(commentLimit, { multiline: true }).optional(),
  })
  .superRefine((input, ctx) => {
    if (input.verdict === 'needs-revision' && !input.comment)
      ctx.addIssue({ code: 'custom', path: ['comment'], message: 'Say what needs revision: the engineer reads it in the item’s thread.' });
  });

/** Body of `POST /api/projects/:id/review-items/:itemId/replies`. */
export const replySchema = z.object({ text: textField(commentLimit, { required: true, multiline: true }) });

/** Body of `POST /api/projects/:id/review-items/bulk`. */
export const bulkSchema = z.object({
  confirm: z.union(
    [
      z.strictObject({ kind: z.enum(reviewItemKinds, { error: 'Choose one kind of check item.' }) }),
      z.strictObject({ unchanged: z.literal(true) }),
    ],
    { error: 'Confirm the items of one kind, or every unchanged item.' },
  ),
});

// What the routes answer, for the served API description; each is checked against the contract's type.

export const reviewItemSchema = z.strictObject({
  id: z.string(),
  kind: z.enum(reviewItemKinds),
  spaceId: z.string().optional(),
  title: z.string(),
  section: z.string(),
  outcome: z.enum(['met', 'not-met', 'to-verify', 'not-required']),
  reasoning: z.string(),
  values: z.array(z.strictObject({ label: z.string(), value: z.string() })),
  verdict: z.enum(reviewVerdicts).nullable(),
  changed: z.boolean(),
  round: z.number().int(),
  thread: z.array(
    z.strictObject({
      by: z.string(),
      role: z.enum(['engineer', 'reviewer', 'contractor', 'admin']),
      at: z.string(),
      text: z.string(),
      verdict: z.enum(reviewVerdicts).optional(),
      round: z.number().int(),
    }),
  ),
}) satisfies z.ZodType<ReviewItem>;

export const reviewBulkResultSchema = z.strictObject({
  confirmed: z.number().int(),
  items: z.array(reviewItemSchema),
}) satisfies z.ZodType<ReviewBulkResult>;

export const reviewDeskEntrySchema = z.strictObject({
  projectId: z.string(),
  name: z.string(),
  state: z.enum(projectStates),
  revision: z.number().int(),
  round: z.number().int(),
  submittedAt: z.string().nullable(),
  submittedBy: z.string().nullable(),
  open: z.number().int(),
  needsRevision: z.number().int(),
  total: z.number().int(),
}) satisfies z.ZodType<ReviewDeskEntry>;
