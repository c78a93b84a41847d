import { z } from 'zod';
import { evaluationDocumentSchema } from '../compliance/index.js';
import { evaluationResultSchema } from './result.schema.js';

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

/** The API description of the evaluation: the project document, the result, and where they travel. */
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
    },
  };
}
