import { z } from 'zod';
import type { Express } from 'express';
import { apiRoutes, openApiPath } from './route-table';
import { OPERATIONS } from './operations';

type Json = Record<string, unknown>;

/** JSON Schema of what a client sends (input side of transforms and defaults). */
const schemaOf = (schema: z.ZodType): Json => {
  const { $schema: _drop, ...rest } = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Json;
  return rest;
};

const ERROR_SCHEMA = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string' },
        message: { type: 'string' },
        fields: { type: 'object', additionalProperties: { type: 'string' }, description: 'Field path → what is wrong with it' },
        issues: {
          type: 'array',
          description: 'Problems in the rows of an uploaded file (CSV import): data row (1 = first after the header), column ("_" = the whole row), message',
          items: {
            type: 'object',
            required: ['row', 'field', 'message'],
            properties: { row: { type: 'integer', minimum: 1 }, field: { type: 'string' }, message: { type: 'string' } },
          },
        },
        issueCount: { type: 'integer', minimum: 0, description: 'All row problems found; issues lists at most 500' },
      },
    },
  },
};

/**
 * The OpenAPI 3.1 description of every mounted route, generated from the route table (methods,
 * paths, guards) and the shared zod schemas. Each operation says who may call it in
 * `x-isobath-access`: a permission, "signed-in" or "public".
 */
export function buildOpenApiDocument(app: Express): Json {
  const paths: Record<string, Record<string, Json>> = {};
  for (const route of apiRoutes(app)) {
    const key = `${route.method.toUpperCase()} ${route.path}`;
    const doc = OPERATIONS[key];
    const params = [...route.path.matchAll(/:([A-Za-z]+)/g)].map((m) => ({
      name: m[1],
      in: 'path',
      required: true,
      schema: { type: m[1] === 'id' && route.path.startsWith('/api/admin/mail') ? 'string' : 'integer', minimum: 1 },
    }));
    const query = doc?.query ? schemaOf(doc.query) : undefined;
    const queryParams = query && typeof query.properties === 'object' && query.properties
      ? Object.entries(query.properties as Record<string, Json>).map(([name, schema]) => ({
          name,
          in: 'query',
          required: Array.isArray(query.required) && (query.required as string[]).includes(name),
          schema,
        }))
      : query && Array.isArray(query.allOf)
        ? (query.allOf as Json[]).flatMap((part) => Object.entries((part.properties as Record<string, Json>) ?? {}).map(([name, schema]) => ({ name, in: 'query', required: false, schema })))
        : [];
    const responses: Record<string, Json> = {};
    const ok = doc?.produces
      ? { description: 'OK', content: { [doc.produces]: { schema: { type: 'string', format: doc.produces === 'application/pdf' ? 'binary' : undefined } } } }
      : { description: 'OK', content: { 'application/json': { schema: { type: 'object' } } } };
    for (const [status, description] of Object.entries(doc?.responses ?? { 200: 'OK' })) {
      responses[status] = Number(status) < 300 ? { ...ok, description } : { description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    }
    responses['400'] ??= { description: 'Invalid input: every bad field is named', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    if (route.access !== 'public') {
      responses['401'] ??= { description: 'Not signed in', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    }
    if (route.access !== 'public' && route.access !== 'signed-in') {
      responses['403'] ??= { description: `Your role lacks "${route.access}"`, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    }
    const operation: Json = {
      summary: doc?.summary ?? '(undocumented)',
      tags: [doc?.tag ?? 'Other'],
      operationId: key.replace(/[^A-Za-z0-9]+/g, '_').replace(/^_|_$/g, ''),
      'x-isobath-access': route.access,
      parameters: [...params, ...queryParams],
      responses,
      ...(route.access === 'public' ? { security: [] } : {}),
    };
    if (doc?.body) operation.requestBody = { required: true, content: { 'application/json': { schema: schemaOf(doc.body) } } };
    if (doc?.upload) {
      operation.requestBody = {
        required: true,
        content: { 'multipart/form-data': { schema: { type: 'object', required: [doc.upload.field], properties: { [doc.upload.field]: { type: 'string', format: 'binary', description: doc.upload.description } } } } },
      };
    }
    (paths[openApiPath(route.path)] ??= {})[route.method] = operation;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Isobath API',
      version: '1',
      description:
        'JSON over HTTPS, SI units throughout (Pa, m, kg/m³, °C). Sign in with POST /api/auth/login and send the session cookie back. ' +
        'State-changing requests must come from the same origin or from a script without an Origin header, with a JSON body. ' +
        'Errors are { "error": { "code", "message", "fields" } }. Results are screening estimates for qualified engineers.',
    },
    servers: [{ url: '/' }],
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'isobath.sid' } },
      schemas: { Error: ERROR_SCHEMA },
    },
    security: [{ session: [] }],
    paths,
  };
}
