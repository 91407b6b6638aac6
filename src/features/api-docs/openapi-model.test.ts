import { describe, expect, it } from 'vitest';
import { describeAccess, filterGroups, groupOperations, resolveRefs, type OpenApiDoc } from './openapi-model';

// A small document in the shape the server publishes (OpenAPI 3.1, paths → methods → operation).
const DOC: OpenApiDoc = {
  openapi: '3.1.0',
  tags: [{ name: 'Projects', description: 'Projects and members' }, { name: 'Calculation' }],
  components: {
    schemas: {
      Pressure: { type: 'object', properties: { value: { type: 'number', description: 'Pa' } } },
      LoadCase: { type: 'object', properties: { pressure: { $ref: '#/components/schemas/Pressure' }, next: { $ref: '#/components/schemas/LoadCase' } } },
    },
  },
  paths: {
    '/api/projects/{id}/members': {
      parameters: [{ name: 'id', in: 'path', schema: { type: 'integer' } }],
      post: {
        summary: 'Add a member',
        tags: ['Projects'],
        'x-isobath-access': 'project:write',
        requestBody: { content: { 'application/json': { schema: { type: 'object', properties: { userId: { type: 'integer' } } } } } },
        responses: { '200': { description: 'The project' }, '403': { description: 'Not the owner' } },
      },
    },
    '/api/evaluate': {
      post: {
        summary: 'Rank candidates for a load case',
        tags: ['Calculation'],
        'x-isobath-access': 'evaluate',
        requestBody: { content: { 'application/json': { schema: { type: 'object', properties: { loadCase: { $ref: '#/components/schemas/LoadCase' } } } } } },
        responses: { '200': { description: 'Ranked results' } },
      },
    },
    '/api/health': { get: { summary: 'Health', 'x-isobath-access': 'public', responses: { '200': { description: 'Up' }, '503': { description: 'Database down' } } } },
    '/api/projects': {
      get: { summary: 'List my projects', tags: ['Projects'], 'x-isobath-access': 'project:read', responses: { '200': { description: 'ok' } } },
      post: { summary: 'Create a project', tags: ['Projects'], 'x-isobath-access': 'project:write', responses: { '201': { description: 'created' } } },
    },
  },
};

describe('API page model', () => {
  it('groups operations by tag in the declared order, untagged last, paths sorted and methods in order', () => {
    const groups = groupOperations(DOC);
    expect(groups.map((g) => g.tag)).toEqual(['Projects', 'Calculation', 'Other']);
    expect(groups[0].operations.map((o) => `${o.method} ${o.path}`)).toEqual(['get /api/projects', 'post /api/projects', 'post /api/projects/{id}/members']);
    expect(groups[0].description).toBe('Projects and members');
  });

  it('keeps path parameters, access, request schema and responses of an operation', () => {
    const op = groupOperations(DOC)[0].operations[2];
    expect(op.parameters).toEqual([{ name: 'id', in: 'path', required: true, type: 'integer', description: '' }]);
    expect(op.access).toBe('project:write');
    expect(op.requestContentType).toBe('application/json');
    expect(op.requestSchema).toEqual({ type: 'object', properties: { userId: { type: 'integer' } } });
    expect(op.responses.map((r) => r.status)).toEqual(['200', '403']);
  });

  it('replaces references by their schema and stops at a schema that contains itself', () => {
    const resolved = resolveRefs({ $ref: '#/components/schemas/LoadCase' }, DOC) as { properties: { pressure: unknown; next: unknown } };
    expect(resolved.properties.pressure).toEqual({ type: 'object', properties: { value: { type: 'number', description: 'Pa' } } });
    expect(resolved.properties.next).toEqual({ $ref: '#/components/schemas/LoadCase' });
    expect(resolveRefs({ $ref: '#/components/schemas/Missing' }, DOC)).toEqual({ $ref: '#/components/schemas/Missing' });
  });

  it('resolves a schema’s own $defs, as JSON Schema generators write recursive types', () => {
    const schema = {
      type: 'object',
      properties: { point: { $ref: '#/$defs/FactorPoint' } },
      $defs: { FactorPoint: { type: 'object', properties: { factor: { type: 'number' } } } },
    };
    expect(resolveRefs(schema, DOC)).toEqual({ type: 'object', properties: { point: { type: 'object', properties: { factor: { type: 'number' } } } } });
  });

  it('names who may call an operation from the role table', () => {
    expect(describeAccess('public')).toMatch(/no sign-in/);
    expect(describeAccess('signed-in')).toBe('Any signed-in account');
    expect(describeAccess('shortlist:check')).toBe('shortlist:check: Checker, Administrator');
    expect(describeAccess(null)).toBe('Not stated');
  });

  it('filters by words in the method, path, summary or access', () => {
    const groups = groupOperations(DOC);
    expect(filterGroups(groups, 'post members').flatMap((g) => g.operations.map((o) => o.path))).toEqual(['/api/projects/{id}/members']);
    expect(filterGroups(groups, 'public').map((g) => g.tag)).toEqual(['Other']);
    expect(filterGroups(groups, '')).toBe(groups);
  });
});
