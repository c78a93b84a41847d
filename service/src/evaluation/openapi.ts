import { z } from 'zod';
import { evaluationDocumentSchema } from '../compliance/index.js';
import { evaluationResultSchema } from './result.schema.js';
import {
  bulkSchema,
  replySchema,
  reviewBulkResultSchema,
  reviewDeskEntrySchema,
  reviewItemSchema,
  verdictSchema,
} from '../review/review.schema.js';

const errorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string' },
        message: { type: 'string' },
        details: {
          type: 'array',
          items: { type: 'object', required: ['path', 'message'], properties: { path: { type: 'string' }, message: { type: 'string' } } },
        },
      },
    },
  },
};

function jsonSchema(schema: z.ZodType, io: 'input' | 'output'): Record<string, unknown> {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as Record<string, unknown>;
  return rest;
}

const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
});

/** The API description of the evaluation (the project document, the result, and where they travel) and of the review's check items. */
export function openApiDocument(): Record<string, unknown> {
  return {
    openapi: '3.1.0',
    info: {
      title: 'Allowlight evaluation API',
      version: '1',
      description:
        'Sign in with POST /api/auth/login (JSON {email, password}); send the session cookie with every call and the returned csrfToken in X-CSRF-Token with every POST, PUT, PATCH and DELETE. Every number the calculation touches travels as an exact decimal string. An evaluation checks energy-code compliance only, not life safety or emergency lighting; local amendments and the authority having jurisdiction govern.',
    },
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'allowlight_session' } },
      schemas: {
        EvaluationDocument: jsonSchema(evaluationDocumentSchema, 'input'),
        EvaluationResult: jsonSchema(evaluationResultSchema, 'output'),
        ReviewItem: jsonSchema(reviewItemSchema, 'output'),
        ReviewVerdictRequest: jsonSchema(verdictSchema, 'input'),
        ReviewReplyRequest: jsonSchema(replySchema, 'input'),
        ReviewBulkRequest: jsonSchema(bulkSchema, 'input'),
        ReviewBulkResult: jsonSchema(reviewBulkResultSchema, 'output'),
        ReviewDeskEntry: jsonSchema(reviewDeskEntrySchema, 'output'),
        Error: errorSchema,
      },
    },
    security: [{ session: [] }],
    paths: {
      '/api/evaluate': {
        post: {
          summary: 'Evaluate a project document; nothing is stored.',
          requestBody: { required: true, content: { 'application/json': { schema: { $ref: '#/components/schemas/EvaluationDocument' } } } },
          responses: {
            '200': {
              description: 'The evaluation.',
              content: { 'application/json': { schema: { $ref: '#/components/schemas/EvaluationResult' } } },
            },
            '400': errorResponse('The document is not valid; `details` lists the path of every problem.'),
            '401': errorResponse('Not signed in.'),
            '403': errorResponse('Missing or wrong X-CSRF-Token.'),
          },
        },
      },
      '/api/projects/{projectId}/document': {
        get: {
          summary: 'A stored project as an evaluation document.',
          parameters: [{ name: 'projectId', in: 'path', required: true, schema: { type: 'string', format: 'uuid' } }],
          responses: {
            '200': {
              description: 'The document.',
              content: { 'application/json': { schema: { $ref: '#/components/schemas/EvaluationDocument' } } },
            },
            '403': errorResponse('Not a member of the project.'),
            '404': errorResponse('No such project.'),
          },
        },
      },
      '/api/projects/{projectId}/results': {
        get: {
          summary: 'The evaluation of a stored project: the same as evaluating its document.',
          parameters: [{ name: 'projectId', in: 'path', required: true, schema: { type: 'string', format: 'uuid' } }],
          responses: {
            '200': {
              description: 'The evaluation.',
              content: { 'application/json': { schema: { $ref: '#/components/schemas/EvaluationResult' } } },
            },
            '400': errorResponse('The stored design is incomplete; `details` lists what is missing.'),
            '403': errorResponse('Not a member of the project.'),
            '404': errorResponse('No such project.'),
          },
        },
      },
      ...reviewPaths(),
    },
  };
}

const json = (ref: string, description: string) => ({
  description,
  content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } },
});
const body = (ref: string) => ({ required: true, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } });
const projectParameter = { name: 'projectId', in: 'path', required: true, schema: { type: 'string', format: 'uuid' } };
const itemParameter = { name: 'itemId', in: 'path', required: true, schema: { type: 'string', format: 'uuid' } };

/** The reviewer's check items and desk. */
function reviewPaths(): Record<string, unknown> {
  const itemList = {
    description: 'The check items of the latest review round (none before the first submission).',
    content: { 'application/json': { schema: { type: 'array', items: { $ref: '#/components/schemas/ReviewItem' } } } },
  };
  return {
    '/api/projects/{projectId}/review-items': {
      get: {
        summary: 'The check items of the latest review round, each with its verdict and thread.',
        parameters: [projectParameter],
        responses: { '200': itemList, '403': errorResponse('Not a member of the project.'), '404': errorResponse('No such project.') },
      },
    },
    '/api/projects/{projectId}/review-items/{itemId}': {
      patch: {
        summary: 'The reviewer records a verdict on one item, while the design is in review; Needs revision needs a comment.',
        parameters: [projectParameter, itemParameter],
        requestBody: body('ReviewVerdictRequest'),
        responses: {
          '200': json('ReviewItem', 'The item with its verdict.'),
          '400': errorResponse('The verdict or comment is not valid.'),
          '403': errorResponse('Only a reviewer records verdicts.'),
          '404': errorResponse('No such project or item.'),
          '409': errorResponse('The design is not in review, or the project is archived.'),
        },
      },
    },
    '/api/projects/{projectId}/review-items/{itemId}/replies': {
      post: {
        summary: 'The engineer or a reviewer replies in the item’s thread.',
        parameters: [projectParameter, itemParameter],
        requestBody: body('ReviewReplyRequest'),
        responses: {
          '201': json('ReviewItem', 'The item with its thread.'),
          '400': errorResponse('The text is empty or too long.'),
          '403': errorResponse('Only the engineer and the reviewers reply.'),
          '404': errorResponse('No such project or item.'),
        },
      },
    },
    '/api/projects/{projectId}/review-items/bulk': {
      post: {
        summary: 'The reviewer confirms every item of one kind, or every unchanged item, that has no verdict yet.',
        parameters: [projectParameter],
        requestBody: body('ReviewBulkRequest'),
        responses: {
          '200': json('ReviewBulkResult', 'How many were confirmed, and the items as they now are.'),
          '400': errorResponse('Neither one kind nor the unchanged items are named.'),
          '403': errorResponse('Only a reviewer confirms.'),
          '409': errorResponse('The design is not in review.'),
        },
      },
    },
    '/api/review-desk': {
      get: {
        summary:
          'The projects the signed-in person reviews (every project for an administrator): in review first, oldest submission first.',
        responses: {
          '200': {
            description: 'The worklist.',
            content: { 'application/json': { schema: { type: 'array', items: { $ref: '#/components/schemas/ReviewDeskEntry' } } } },
          },
          '401': errorResponse('Not signed in.'),
        },
      },
    },
  };
}
