import type { Express } from 'express';
import { z } from 'zod';
import type { RequestSchemas } from '../../middleware/validate';
import { SAFETY_CAUTION } from '../reactions/reaction-answer';
import { ROUTE_DOCS, type Access, type AnswerBody, type RouteDoc } from './route-docs';

/** One route as Express registered it, with the request schemas its validator checks. */
export interface RegisteredRoute {
  method: string;
  path: string;
  schemas: RequestSchemas;
}

interface Layer {
  route?: { path: string | string[]; methods: Record<string, boolean>; stack: Layer[] };
  handle?: { stack?: Layer[]; schemas?: RequestSchemas };
  rawPath?: unknown;
}

/** Walks the app's router: every method and full path, prefixes of mounted routers included. */
export function registeredRoutes(app: Express): RegisteredRoute[] {
  const found: RegisteredRoute[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        const schemas = Object.assign(
          {},
          ...layer.route.stack.map((l) => l.handle?.schemas ?? {}),
        ) as RequestSchemas;
        for (const method of Object.keys(layer.route.methods).filter((m) => m !== '_all')) {
          for (const p of paths) {
            // The SPA fallback is a pattern, not an API route.
            if (typeof p === 'string')
              found.push({ method: method.toUpperCase(), path: prefix + p, schemas });
          }
        }
      } else if (layer.handle?.stack) {
        const raw = layer.rawPath;
        walk(layer.handle.stack, prefix + (typeof raw === 'string' && raw !== '/' ? raw : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found;
}

export const routeKey = (r: { method: string; path: string }) => `${r.method} ${r.path}`;

const jsonSchema = (schema: z.ZodType, io: 'input' | 'output') =>
  z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' });

const ErrorAnswer = z.object({
  error: z
    .object({ code: z.string(), message: z.string() })
    .catchall(z.unknown())
    .describe('`code` is stable and machine-readable; `message` is for people'),
});

const SECURITY: Record<Access, Record<string, string[]>[] | undefined> = {
  public: undefined,
  'signed-in': [{ session: [] }, { token: [] }],
  curator: [{ session: [] }, { token: [] }],
  editor: [{ session: [] }, { token: [] }],
  admin: [{ session: [] }, { token: [] }],
};

function answerContent(body: AnswerBody) {
  if ('mediaType' in body) {
    return { description: body.description, content: { [body.mediaType]: {} } };
  }
  return {
    description: 'OK',
    content: { 'application/json': { schema: jsonSchema(body, 'output') } },
  };
}

function parametersOf(route: RegisteredRoute, doc: RouteDoc) {
  const out: object[] = [];
  for (const [where, schema] of [
    ['path', route.schemas.params],
    ['query', route.schemas.query],
  ] as const) {
    const props = schema ? (jsonSchema(schema, 'input').properties ?? {}) : {};
    const required = schema ? (jsonSchema(schema, 'input').required ?? []) : [];
    for (const [name, s] of Object.entries(props)) {
      out.push({
        name,
        in: where,
        required: where === 'path' || required.includes(name),
        schema: s,
        ...(doc.example?.[where]?.[name] !== undefined
          ? { example: doc.example[where]![name] }
          : {}),
      });
    }
  }
  // Path parameters a validator does not check (e.g. behind a guard) are still named.
  for (const m of route.path.matchAll(/:(\w+)/g)) {
    if (!out.some((p) => (p as { name: string }).name === m[1])) {
      out.push({ name: m[1], in: 'path', required: true, schema: { type: 'string' } });
    }
  }
  return out;
}

function operation(route: RegisteredRoute, doc: RouteDoc) {
  const responses: Record<string, object> = {};
  for (const [status, body] of Object.entries(doc.answers)) responses[status] = answerContent(body);
  responses['4XX'] = {
    description: 'The request cannot be answered; the code says why',
    content: { 'application/json': { schema: jsonSchema(ErrorAnswer, 'output') } },
  };
  const body = route.schemas.body;
  return {
    tags: [doc.tag],
    summary: doc.summary,
    description: doc.access === 'public' ? 'Open to anyone.' : `Needs: ${doc.access}.`,
    operationId: `${route.method.toLowerCase()}${route.path.replace(/[^A-Za-z0-9]+(.)?/g, (_, c: string | undefined) => (c ?? '').toUpperCase())}`,
    parameters: parametersOf(route, doc),
    ...(body || doc.requestMediaType
      ? {
          requestBody: {
            required: true,
            content: {
              [doc.requestMediaType ?? 'application/json']: {
                ...(body ? { schema: jsonSchema(body, 'input') } : {}),
                ...(doc.example?.body !== undefined ? { example: doc.example.body } : {}),
              },
            },
          },
        }
      : {}),
    responses,
    ...(SECURITY[doc.access] ? { security: SECURITY[doc.access] } : {}),
  };
}

/** Express `:name` → OpenAPI `{name}`. */
export const openApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');

/** The OpenAPI 3.1 document of the app, generated from the routes it serves and their contracts. */
export function buildOpenApiDocument(app: Express, version: string) {
  const paths: Record<string, Record<string, object>> = {};
  for (const route of registeredRoutes(app)) {
    const doc = ROUTE_DOCS[routeKey(route)];
    if (!doc) continue; // the reference test names every undocumented route
    (paths[openApiPath(route.path)] ??= {})[route.method.toLowerCase()] = operation(route, doc);
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Thalpos API',
      version,
      description: [
        'A curated, versioned registry of standard formation enthalpies, and reaction enthalpies',
        "computed from it by Hess's law against a pinned, immutable release.",
        '',
        'Errors are JSON `{"error":{"code","message",…}}`. Anonymous use is rate-limited per',
        'address; send `Authorization: Bearer <token>` (create one on the Integrate page) for a',
        'higher limit of your own. Energies are in the requested unit (kJ/mol by default).',
        '',
        `**Caution.** ${SAFETY_CAUTION}`,
      ].join('\n'),
    },
    servers: [{ url: '/' }],
    components: {
      securitySchemes: {
        token: { type: 'http', scheme: 'bearer', description: 'A personal API token' },
        session: { type: 'apiKey', in: 'cookie', name: 'thalpos.sid' },
      },
    },
    paths,
  };
}
