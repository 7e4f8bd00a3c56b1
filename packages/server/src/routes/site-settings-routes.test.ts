import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, type TestApp } from '../testing/create-test-app.js';

describe('GET /api/v1/site-settings', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let plain: TestApp;
  let withTiles: TestApp;
  beforeAll(async () => {
    database = await createTestDatabase();
    plain = await createTestApp(database);
    withTiles = await createTestApp(database, {
      tileUrl: 'http://127.0.0.1:9000/{z}/{x}/{y}.png',
      tileAttribution: 'Hollowtide charts',
    });
  });
  afterAll(async () => {
    await plain.close();
    await withTiles.close();
    await database.drop();
  });

  it('answers null without a tile template, and the page may load images only from itself', async () => {
    const response = await request(plain.app).get('/api/v1/site-settings').expect(200);
    expect(response.body).toEqual({ tileUrl: null, tileAttribution: null });
    expect(response.headers['content-security-policy']).toMatch(/img-src 'self' data: blob:;/);
  });

  it('gives the configured template to anyone and lets the page load images from the tile host', async () => {
    const response = await request(withTiles.app).get('/api/v1/site-settings').expect(200);
    expect(response.body).toEqual({
      tileUrl: 'http://127.0.0.1:9000/{z}/{x}/{y}.png',
      tileAttribution: 'Hollowtide charts',
    });
    expect(response.headers['content-security-policy']).toMatch(
      /img-src 'self' data: blob: http:\/\/127\.0\.0\.1:9000;/,
    );
  });
});
