import { PERMISSIONS, ROLES, ROLE_LABELS, ROLE_PERMISSIONS, type Permission } from '@shared/schemas/auth';

/** The parts of an OpenAPI 3.1 document this page reads; everything else is ignored. */
export interface OpenApiDoc {
  openapi?: string;
  info?: { title?: string; version?: string; description?: string };
  tags?: { name: string; description?: string }[];
  paths?: Record<string, Record<string, unknown>>;
  components?: { schemas?: Record<string, unknown>; parameters?: Record<string, unknown> };
}

interface RawParameter {
  name?: string;
  in?: string;
  required?: boolean;
  description?: string;
  schema?: unknown;
  $ref?: string;
}

interface RawOperation {
  summary?: string;
  description?: string;
  operationId?: string;
  tags?: string[];
  'x-isobath-access'?: string;
  parameters?: RawParameter[];
  requestBody?: { required?: boolean; content?: Record<string, { schema?: unknown }> } & { $ref?: string };
  responses?: Record<string, { description?: string } & { $ref?: string }>;
}

export const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;
export type Method = (typeof METHODS)[number];

export interface ParameterView {
  name: string;
  in: string;
  required: boolean;
  type: string;
  description: string;
}

export interface OperationView {
  id: string;
  method: Method;
  path: string;
  summary: string;
  description: string;
  access: string | null;
  parameters: ParameterView[];
  requestContentType: string | null;
  requestSchema: unknown;
  responses: { status: string; description: string }[];
}

export interface TagGroup {
  tag: string;
  description: string;
  operations: OperationView[];
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Follows a local "#/components/…" reference; null when it points nowhere. */
function lookup(doc: OpenApiDoc, ref: string): unknown {
  if (!ref.startsWith('#/')) return null;
  let node: unknown = doc;
  for (const part of ref.slice(2).split('/')) {
    const key = part.replace(/~1/g, '/').replace(/~0/g, '~');
    if (!isObject(node) || !(key in node)) return null;
    node = node[key];
  }
  return node;
}

/**
 * The schema with local references replaced by what they point to, so it reads as one JSON
 * document: "#/components/…" points into the document, "#/$defs/…" into the enclosing schema's
 * own definitions (as JSON Schema generators write them). A reference met again inside itself
 * (recursion) is left as {"$ref"} to stop.
 */
export function resolveRefs(schema: unknown, doc: OpenApiDoc, seen: ReadonlySet<string> = new Set(), defs: Record<string, unknown> = {}): unknown {
  if (Array.isArray(schema)) return schema.map((s) => resolveRefs(s, doc, seen, defs));
  if (!isObject(schema)) return schema;
  const scope = isObject(schema.$defs) ? { ...defs, ...schema.$defs } : defs;
  const ref = typeof schema.$ref === 'string' ? schema.$ref : null;
  if (ref) {
    const target = ref.startsWith('#/$defs/') ? (scope[ref.slice('#/$defs/'.length)] ?? null) : lookup(doc, ref);
    if (target === null || seen.has(ref)) return schema;
    const { $ref: _ignored, ...rest } = schema;
    const resolved = resolveRefs(target, doc, new Set([...seen, ref]), scope);
    return Object.keys(rest).length && isObject(resolved) ? { ...resolved, ...(resolveRefs(rest, doc, seen, scope) as object) } : resolved;
  }
  // Definitions are shown where they are used, not a second time at the end.
  return Object.fromEntries(
    Object.entries(schema)
      .filter(([k]) => k !== '$defs')
      .map(([k, v]) => [k, resolveRefs(v, doc, seen, scope)]),
  );
}

function typeOf(schema: unknown): string {
  if (!isObject(schema)) return '';
  if (typeof schema.type === 'string') return schema.format ? `${schema.type} (${String(schema.format)})` : schema.type;
  if (Array.isArray(schema.type)) return schema.type.join(' | ');
  if (Array.isArray(schema.enum)) return schema.enum.map((e) => JSON.stringify(e)).join(' | ');
  return '';
}

function parameterView(raw: RawParameter, doc: OpenApiDoc): ParameterView | null {
  const p = (raw.$ref ? lookup(doc, raw.$ref) : raw) as RawParameter | null;
  if (!p || typeof p.name !== 'string') return null;
  const schema = resolveRefs(p.schema, doc);
  return { name: p.name, in: p.in ?? 'query', required: p.required === true || p.in === 'path', type: typeOf(schema), description: p.description ?? '' };
}

/** Every operation of the document, grouped by its first tag, in the document's tag order. */
export function groupOperations(doc: OpenApiDoc): TagGroup[] {
  const groups = new Map<string, OperationView[]>();
  for (const [path, item] of Object.entries(doc.paths ?? {})) {
    if (!isObject(item)) continue;
    const shared = Array.isArray(item.parameters) ? (item.parameters as RawParameter[]) : [];
    for (const method of METHODS) {
      const raw = item[method];
      if (!isObject(raw)) continue;
      const op = raw as RawOperation;
      const params = [...shared, ...(op.parameters ?? [])].map((p) => parameterView(p, doc)).filter((p): p is ParameterView => p !== null);
      // A parameter given on the operation replaces one of the same name and place on the path.
      const unique = params.filter((p, i) => params.findLastIndex((q) => q.name === p.name && q.in === p.in) === i);
      const body = op.requestBody?.$ref ? (lookup(doc, op.requestBody.$ref) as RawOperation['requestBody']) : op.requestBody;
      const [contentType, media] = Object.entries(body?.content ?? {})[0] ?? [null, null];
      const tag = op.tags?.[0] ?? 'Other';
      const view: OperationView = {
        id: `${method}-${path}`.replace(/[^A-Za-z0-9]+/g, '-'),
        method,
        path,
        summary: op.summary ?? '',
        description: op.description ?? '',
        access: typeof op['x-isobath-access'] === 'string' ? op['x-isobath-access'] : null,
        parameters: unique,
        requestContentType: contentType,
        requestSchema: media?.schema === undefined ? null : resolveRefs(media.schema, doc),
        responses: Object.entries(op.responses ?? {})
          .map(([status, r]) => ({ status, description: (r?.$ref ? (lookup(doc, r.$ref) as { description?: string } | null)?.description : r?.description) ?? '' }))
          .sort((a, b) => a.status.localeCompare(b.status)),
      };
      groups.set(tag, [...(groups.get(tag) ?? []), view]);
    }
  }
  const declared = (doc.tags ?? []).map((t) => t.name);
  const order = (tag: string) => (declared.includes(tag) ? declared.indexOf(tag) : declared.length);
  return [...groups.entries()]
    .sort(([a], [b]) => order(a) - order(b) || (a === 'Other' ? 1 : b === 'Other' ? -1 : a.localeCompare(b)))
    .map(([tag, operations]) => ({
      tag,
      description: doc.tags?.find((t) => t.name === tag)?.description ?? '',
      operations: operations.sort((a, b) => a.path.localeCompare(b.path) || METHODS.indexOf(a.method) - METHODS.indexOf(b.method)),
    }));
}

/** Who may call an operation, in words: public, any signed-in account, or the roles holding a permission. */
export function describeAccess(access: string | null): string {
  if (access === null) return 'Not stated';
  if (access === 'public') return 'Public: no sign-in needed';
  if (access === 'signed-in') return 'Any signed-in account';
  if ((PERMISSIONS as readonly string[]).includes(access)) {
    const roles = ROLES.filter((r) => ROLE_PERMISSIONS[r].includes(access as Permission)).map((r) => ROLE_LABELS[r]);
    return `${access}: ${roles.join(', ')}`;
  }
  return access;
}

/** Operations whose method, path, summary, tag or access contain every word of the query. */
export function filterGroups(groups: TagGroup[], query: string): TagGroup[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (!words.length) return groups;
  return groups
    .map((g) => ({
      ...g,
      operations: g.operations.filter((op) => {
        const text = `${op.method} ${op.path} ${op.summary} ${g.tag} ${op.access ?? ''}`.toLowerCase();
        return words.every((w) => text.includes(w));
      }),
    }))
    .filter((g) => g.operations.length > 0);
}
