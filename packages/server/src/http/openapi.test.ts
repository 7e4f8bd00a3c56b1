import { Validator } from '@seriousme/openapi-schema-validator';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, type TestApp } from '../testing/create-test-app.js';

describe('buildOpenApiDocument', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let document: { openapi: string; paths: Record<string, Record<string, Record<string, unknown>>> };
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
    document = (await request(testApp.app).get('/api/v1/openapi.json').expect(200)).body;
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('is a valid OpenAPI 3.1 document by the specification’s own JSON Schema', async () => {
    // @seriousme/openapi-schema-validator checks against the schemas published by the OpenAPI Initiative.
    const result = await new Validator().validate(document as unknown as Record<string, unknown>);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
    expect(document.openapi).toBe('3.1.0');
  });

  it('documents every route of the table, with the request body taken from its zod schema', () => {
    const operations = Object.entries(document.paths).flatMap(([path, item]) =>
      Object.keys(item).map((method) => `${method.toUpperCase()} ${path}`),
    );
    const table = testApp.routes.map((r) => `${r.method.toUpperCase()} /api/v1${r.path.replace(/:(\w+)/g, '{$1}')}`);
    expect(operations.sort()).toEqual(table.sort());
    const signIn = document.paths['/api/v1/session']?.post as {
      requestBody: {
        content: {
          'application/json': { schema: { required: string[]; properties: Record<string, { format?: string }> } };
        };
      };
    };
    const schema = signIn.requestBody.content['application/json'].schema;
    expect(schema.required.sort()).toEqual(['email', 'password']);
    expect(schema.properties.email?.format).toBe('email');
  });

  it('serves an offline docs page whose scripts all come from this server', async () => {
    const page = await request(testApp.app).get('/api/docs/').expect(200);
    const sources = [...page.text.matchAll(/(?:src|href)="([^"]+)"/g)].map((m) => m[1] ?? '');
    expect(sources.length).toBeGreaterThanOrEqual(3);
    for (const source of sources) {
      expect(source.startsWith('/api/docs/')).toBe(true);
      await request(testApp.app).get(source).expect(200);
    }
    expect(page.text).not.toMatch(/<script>[^<]/);
  });
});
