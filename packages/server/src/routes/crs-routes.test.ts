import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

describe('GET /api/v1/crs', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let viewer: Awaited<ReturnType<typeof signedInAgent>>;

  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
    await seedOrganisation(database.db, 'Hollowtide Subsea', [{ email: 'ilse@hollowtide.example', role: 'viewer' }]);
    viewer = await signedInAgent(testApp, 'ilse@hollowtide.example');
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('finds a CRS by its code, typed bare or with the EPSG prefix', async () => {
    for (const q of ['25832', 'EPSG:25832', 'epsg:25832']) {
      const response = await viewer.get('/api/v1/crs').query({ q }).expect(200);
      // EPSG registry: code 25832 is "ETRS89 / UTM zone 32N" (from memory).
      expect(response.body.crs[0]).toMatchObject({
        code: 'EPSG:25832',
        name: 'ETRS89 / UTM zone 32N',
        kind: 'projected',
      });
    }
  });

  it('finds CRSs by words of the name, every word matching, within the limit', async () => {
    const response = await viewer.get('/api/v1/crs').query({ q: 'etrs89 utm 32n', limit: 5 }).expect(200);
    expect(response.body.crs.length).toBeGreaterThan(0);
    expect(response.body.crs.length).toBeLessThanOrEqual(5);
    expect(response.body.crs.map((c: { code: string }) => c.code)).toContain('EPSG:25832');
    for (const crs of response.body.crs as Array<{ name: string }>) expect(crs.name.toLowerCase()).toContain('etrs89');
  });

  it('answers an empty list, not an error, for words nothing matches', async () => {
    const response = await viewer.get('/api/v1/crs').query({ q: 'nowhere-at-all-zzz' }).expect(200);
    expect(response.body).toEqual({ crs: [] });
  });

  it('lists the CRSs whose area of use covers a position, each area containing it', async () => {
    const response = await viewer.get('/api/v1/crs').query({ at: '50,9', limit: 50 }).expect(200);
    const codes = response.body.crs.map((c: { code: string }) => c.code);
    // EPSG registry areas of use (from memory): WGS 84 / UTM zone 32N covers 6°E–12°E north of the
    // equator; ETRS89 / UTM zone 32N covers Europe between 6°E and 12°E.
    expect(codes).toContain('EPSG:32632');
    expect(codes).toContain('EPSG:25832');
    expect(codes).not.toContain('EPSG:32633');
    for (const crs of response.body.crs as Array<{
      areaOfUse: { west: number; south: number; east: number; north: number };
    }>) {
      const { west, south, east, north } = crs.areaOfUse;
      expect(south).toBeLessThanOrEqual(50);
      expect(north).toBeGreaterThanOrEqual(50);
      if (west <= east) expect(west <= 9 && east >= 9).toBe(true);
      else expect(west <= 9 || east >= 9).toBe(true);
    }
  });

  it('refuses bad input with 400 and says what was expected', async () => {
    const cases: Array<[Record<string, string>, RegExp]> = [
      [{}, /exactly one of q/],
      [{ q: 'utm', at: '50,9' }, /exactly one of q/],
      [{ at: 'north sea' }, /latitude,longitude/],
      [{ at: '95,9' }, /within ±90/],
      [{ q: '' }, /at least one character/],
      [{ q: 'utm', limit: '500' }, /.+/],
    ];
    for (const [query, message] of cases) {
      const response = await viewer.get('/api/v1/crs').query(query).expect(400);
      expect(response.body.error.code).toBe('bad-request');
      expect(JSON.stringify(response.body.error)).toMatch(message);
    }
  });

  it('needs a signed-in caller', async () => {
    const response = await request(testApp.app).get('/api/v1/crs').query({ q: 'utm' }).expect(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });
});
