import { z } from 'zod';
import type { RouteSpec } from './route-table.js';

/** The one error body, as a schema: every error response of the API has this shape. */
export const ErrorBodySchema = z.object({
  error: z.object({
    code: z.string().describe('Stable machine-readable code, e.g. not-found'),
    message: z.string().describe('What went wrong and what to do, for people'),
    details: z.unknown().optional(),
  }),
});

const ERROR_DESCRIPTIONS: Record<number, string> = {
  400: 'The request is not valid (path, query or body)',
  401: 'Not signed in, or the API token is unknown, revoked or expired',
  403: 'Signed in but not allowed',
  404: 'No such thing here',
  409: 'Conflicts with the current state',
  413: 'The upload is larger than the limit',
  422: 'Well-formed but cannot be processed',
  429: 'Too many attempts; wait and retry',
};

type JsonSchema = Record<string, unknown>;

function toSchema(schema: z.ZodType, io: 'input' | 'output'): JsonSchema {
  const json = z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as JsonSchema;
  delete json.$schema;
  return json;
}

function parametersOf(schema: z.ZodType | undefined, where: 'path' | 'query'): JsonSchema[] {
  if (schema === undefined) return [];
  const json = toSchema(schema, 'input');
  const properties = (json.properties ?? {}) as Record<string, JsonSchema>;
  const required = new Set((json.required ?? []) as string[]);
  return Object.entries(properties).map(([name, property]) => ({
    name,
    in: where,
    required: where === 'path' || required.has(name),
    ...(typeof property.description === 'string' ? { description: property.description } : {}),
    schema: property,
  }));
}

const ACCESS_TEXT: Record<RouteSpec['access'], string> = {
  public: 'Anyone.',
  'signed-in': 'Any signed-in user or API token.',
  'any-admin': 'An admin of any organisation.',
  viewer: 'A member of the organisation (viewer or above).',
  editor: 'An editor or admin of the organisation.',
  admin: 'An admin of the organisation.',
};

/** Builds the OpenAPI 3.1 document of the API from the route table and its zod schemas. */
export function buildOpenApiDocument(routes: readonly RouteSpec[], info: { version: string }): JsonSchema {
  const paths: Record<string, Record<string, JsonSchema>> = {};
  for (const route of routes) {
    const path = `/api/v1${route.path.replace(/:([A-Za-z0-9_]+)/g, '{$1}')}`;
    const responses: Record<string, JsonSchema> = {};
    for (const [status, spec] of Object.entries(route.responses)) {
      responses[status] = {
        description: spec.description,
        ...(spec.schema === undefined && spec.contentType === undefined
          ? {}
          : {
              content: {
                [spec.contentType ?? 'application/json']: {
                  schema: spec.schema === undefined ? {} : toSchema(spec.schema, 'output'),
                },
              },
            }),
      };
    }
    const errors = new Set<number>([400]);
    if (route.access !== 'public') {
      errors.add(401);
      errors.add(403);
    }
    if (route.path.includes(':')) errors.add(404);
    if (route.upload !== undefined) errors.add(413);
    if (route.before !== undefined) errors.add(429);
    for (const status of errors) {
      if (responses[String(status)] !== undefined) continue;
      responses[String(status)] = {
        description: ERROR_DESCRIPTIONS[status] ?? 'Error',
        content: { 'application/json': { schema: { $ref: '#/components/schemas/ErrorBody' } } },
      };
    }
    let requestBody: JsonSchema | undefined;
    if (route.upload !== undefined) {
      const fields = route.body === undefined ? { type: 'object', properties: {} } : toSchema(route.body, 'input');
      const properties = { ...((fields.properties ?? {}) as JsonSchema) };
      properties[route.upload.field] = {
        type: 'array',
        items: { type: 'string', contentMediaType: 'application/octet-stream' },
      };
      requestBody = {
        required: true,
        content: { 'multipart/form-data': { schema: { ...fields, properties, required: [route.upload.field] } } },
      };
    } else if (route.body !== undefined) {
      requestBody = { required: true, content: { 'application/json': { schema: toSchema(route.body, 'input') } } };
    }
    const operation: JsonSchema = {
      operationId: `${route.method}${route.path.replace(/[:/{}-]+(\w)/g, (_m, c: string) => c.toUpperCase())}`,
      summary: route.summary,
      description: `Who may call it: ${ACCESS_TEXT[route.access]}${route.sessionOnly ? ' Browser sessions only, not API tokens.' : ''}`,
      tags: [route.tag],
      parameters: [...parametersOf(route.params, 'path'), ...parametersOf(route.query, 'query')],
      ...(requestBody === undefined ? {} : { requestBody }),
      responses,
      security:
        route.access === 'public' ? [] : route.sessionOnly ? [{ session: [] }] : [{ session: [] }, { bearer: [] }],
    };
    paths[path] ??= {};
    const item = paths[path];
    if (item !== undefined) item[route.method] = operation;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Leadline API',
      version: info.version,
      description:
        'Archive, check and convert USBL position logs. Errors always have the body { error: { code, message, details? } }.',
    },
    jsonSchemaDialect: 'https://spec.openapis.org/oas/3.1/dialect/base',
    servers: [{ url: '/' }],
    paths,
    components: {
      schemas: { ErrorBody: toSchema(ErrorBodySchema, 'output') },
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: 'leadline.sid' },
        bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'llt_… API token' },
      },
    },
  };
}
