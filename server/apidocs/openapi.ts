/**
 * The OpenAPI 3.1 document of the API, built from the route table (every
 * route, its roles) and routeDocs (the zod schemas each handler validates
 * with, as JSON Schema through zod's own converter). Served at
 * GET /api/docs/openapi.json; docs/api.md explains how to read it.
 */
import { z } from 'zod';
import type { RouteSpec } from '../http/routes';
import { routeDocs, type RouteDoc } from './schemas';

type Json = Record<string, unknown>;

/** JSON Schema of what a client sends (the input side of transforms and defaults). */
export function jsonSchemaOf(schema: z.ZodType): Json {
  const { $schema: _drop, ...rest } = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Json;
  return rest;
}

const errorBody = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string', description: 'kebab-case, stable: what a program tests' },
        message: { type: 'string', description: 'a sentence a person can act on' },
        details: { description: 'per-field or per-row detail, where there is any' },
      },
    },
  },
};

const errorAnswer = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } });

function queryParameters(doc: RouteDoc | undefined): Json[] {
  if (!doc?.query) return [];
  const s = jsonSchemaOf(doc.query) as { properties?: Record<string, Json>; required?: string[] };
  return Object.entries(s.properties ?? {}).map(([name, schema]) => ({ name, in: 'query', required: s.required?.includes(name) ?? false, schema }));
}

function operation(spec: RouteSpec, doc: RouteDoc | undefined): Json {
  const pathParams = [...spec.path.matchAll(/:(\w+)/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string' } }));
  const roles = spec.roles === 'public' ? 'anyone, no sign-in' : spec.roles.join(', ');
  const responses: Json = {
    '200': doc?.answer
      ? { description: 'done', content: { 'application/json': { schema: jsonSchemaOf(doc.answer) } } }
      : { description: 'done (JSON; the shapes are the TypeScript types in shared/schemas/)' },
    '400': errorAnswer('the request is malformed; the message names the field'),
    '404': errorAnswer('an unknown code or path; the message names it'),
  };
  if (spec.roles !== 'public') {
    responses['401'] = errorAnswer('no valid bearer token');
    responses['403'] = errorAnswer(`the role may not do this (allowed: ${roles})`);
  }
  const op: Json = {
    summary: doc?.summary ?? `${spec.method.toUpperCase()} ${spec.path}`,
    description: [doc?.description, `Roles: ${roles}.`].filter(Boolean).join('\n\n'),
    tags: [spec.path.split('/')[2] ?? 'api'],
    parameters: [...pathParams, ...queryParameters(doc)],
    responses,
  };
  if (spec.roles !== 'public') op.security = [{ bearer: [] }];
  if (doc?.body) op.requestBody = { required: true, content: { 'application/json': { schema: jsonSchemaOf(doc.body) } } };
  return op;
}

export function openApiDocument(specs: readonly RouteSpec[], version = '0.1.0'): Json {
  const paths: Record<string, Json> = {};
  for (const spec of specs) {
    const path = spec.path.replace(/:(\w+)/g, '{$1}');
    paths[path] ??= {};
    paths[path][spec.method] = operation(spec, routeDocs[`${spec.method} ${spec.path}`]);
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Headwater API',
      version,
      description: 'Inventory, fault reach, resilience and feed screening for a broadcast transmission network. Sign in with POST /api/auth/login and send the token as `Authorization: Bearer <token>`. Vocabulary and rules: docs/domain.md; the document format: docs/format.md.',
    },
    paths,
    components: {
      securitySchemes: { bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' } },
      schemas: { Error: errorBody },
    },
  };
}
