import { createHash } from 'node:crypto';
import { DEMO_SITES, simulateSeason } from '@leadline/core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { DEMO_SEASON, DEMO_USERS, loadDemoData } from './load-demo-data.js';

// A short season keeps the test quick; npm start loads DEMO_SEASON through the same code.
const SHORT_SEASON = { seed: DEMO_SEASON.seed, dives: 5, diveMinutes: 5 };

describe('loadDemoData', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  beforeAll(async () => {
    database = await createTestDatabase();
  });
  afterAll(async () => {
    await database.drop();
  });

  it('loads the organisation, a few people of each role, a project per site and every log of the season byte for byte', async () => {
    const result = await loadDemoData(database.db, SHORT_SEASON);
    expect(result.loaded).toBe(true);
    expect(result.projects).toBe(DEMO_SITES.length);

    const roles = await database
      .db('memberships')
      .select('role')
      .count<{ role: string; count: string }[]>({ count: '*' })
      .groupBy('role');
    for (const role of ['admin', 'editor', 'viewer']) {
      expect(Number(roles.find((r) => r.role === role)?.count ?? 0)).toBeGreaterThanOrEqual(2);
    }
    expect(DEMO_USERS[0]).toMatchObject({ email: 'maren@hollowtide.example', role: 'admin' });

    const projects = await database.db('projects').select('name', 'time_zone', 'default_crs');
    expect(projects.map((p) => p.time_zone).sort()).toEqual(['Australia/Hobart', 'Europe/London', 'Europe/Oslo']);

    const expected = [...simulateSeason(SHORT_SEASON)].flatMap((d) => d.files);
    const rows = await database
      .db('logs')
      .select('original_file_name', 'content', 'sha256', 'size_bytes', 'uploaded_by');
    expect(rows).toHaveLength(expected.length);
    expect(result.logs).toBe(expected.length);
    for (const file of expected) {
      const name = file.name.slice(file.name.lastIndexOf('/') + 1);
      const row = rows.find((r) => r.original_file_name === name);
      expect(row).toBeDefined();
      const bytes = Buffer.from(file.text, 'utf8');
      expect(Buffer.compare(row?.content as Buffer, bytes)).toBe(0);
      expect(row?.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
      expect(Number(row?.size_bytes)).toBe(bytes.byteLength);
      expect(row?.uploaded_by).not.toBeNull();
    }
  });

  it('changes nothing when run again', async () => {
    const before = await database.db('logs').count<{ count: string }[]>({ count: '*' }).first();
    const again = await loadDemoData(database.db, SHORT_SEASON);
    expect(again).toEqual({ loaded: false, projects: 0, logs: 0 });
    const after = await database.db('logs').count<{ count: string }[]>({ count: '*' }).first();
    expect(after?.count).toBe(before?.count);
    expect(await database.db('users').count<{ count: string }[]>({ count: '*' }).first()).toEqual({
      count: String(DEMO_USERS.length),
    });
  });

  it('refuses the same bytes twice in one project (re-upload is idempotent by SHA-256)', async () => {
    const row = await database.db('logs').first('project_id', 'original_file_name', 'content', 'sha256', 'size_bytes');
    await expect(database.db('logs').insert({ ...row, original_file_name: 'renamed.csv' })).rejects.toThrow(
      /logs_project_sha256_unique/,
    );
  });
});
