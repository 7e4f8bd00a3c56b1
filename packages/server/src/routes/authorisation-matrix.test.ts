import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import type { RouteSpec } from '../http/route-table.js';
import type { Role } from '../services/roles.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

// The matrix walks the route table the app is built from, so a new route is in it the moment it is mounted.
// The rules below restate the access model of issue 9 independently of the code under test.

type Principal =
  | { name: string; kind: 'anonymous' }
  | { name: string; kind: 'session'; email: string; roleInA: Role | null; adminAnywhere: boolean }
  | { name: string; kind: 'token'; tokenOf: string; scope: 'read' | 'read-write'; roleInA: Role; valid: boolean };

const PRINCIPALS: Principal[] = [
  { name: 'anonymous', kind: 'anonymous' },
  { name: 'viewer', kind: 'session', email: 'ilse@hollowtide.example', roleInA: 'viewer', adminAnywhere: false },
  { name: 'editor', kind: 'session', email: 'tomas@hollowtide.example', roleInA: 'editor', adminAnywhere: false },
  { name: 'admin', kind: 'session', email: 'maren@hollowtide.example', roleInA: 'admin', adminAnywhere: true },
  {
    name: "another organisation's admin",
    kind: 'session',
    email: 'odile@brinewater.example',
    roleInA: null,
    adminAnywhere: true,
  },
  {
    name: "admin's read-only token",
    kind: 'token',
    tokenOf: 'maren@hollowtide.example',
    scope: 'read',
    roleInA: 'admin',
    valid: true,
  },
  {
    name: "editor's read-write token",
    kind: 'token',
    tokenOf: 'tomas@hollowtide.example',
    scope: 'read-write',
    roleInA: 'editor',
    valid: true,
  },
  {
    name: 'revoked token',
    kind: 'token',
    tokenOf: 'maren@hollowtide.example',
    scope: 'read-write',
    roleInA: 'admin',
    valid: false,
  },
  {
    name: 'expired token',
    kind: 'token',
    tokenOf: 'maren@hollowtide.example',
    scope: 'read-write',
    roleInA: 'admin',
    valid: false,
  },
];

// Who may call what, written down on purpose: a route missing here fails the test, so whoever adds one
// must decide its access here as well as in the route table. `+session` marks routes refused to tokens.
const INTENDED_ACCESS: Record<string, string> = {
  'GET /health': 'public',
  'GET /ready': 'public',
  'GET /openapi.json': 'public',
  'POST /session': 'public',
  'DELETE /session': 'signed-in+session',
  'GET /me': 'signed-in',
  'PUT /me/password': 'signed-in+session',
  'POST /organisations': 'signed-in+session',
  'GET /organisations/:organisationId': 'viewer',
  'PATCH /organisations/:organisationId': 'admin',
  'GET /organisations/:organisationId/members': 'admin',
  'PATCH /organisations/:organisationId/members/:userId': 'admin',
  'DELETE /organisations/:organisationId/members/:userId': 'admin',
  'GET /organisations/:organisationId/activity': 'admin',
  'POST /organisations/:organisationId/invitations': 'admin',
  'GET /organisations/:organisationId/invitations': 'admin',
  'DELETE /organisations/:organisationId/invitations/:invitationId': 'admin',
  'POST /invitations/accept': 'public',
  'POST /password-reset': 'public',
  'POST /password-reset/complete': 'public',
  'POST /organisations/:organisationId/tokens': 'viewer+session',
  'GET /organisations/:organisationId/tokens': 'viewer',
  'DELETE /organisations/:organisationId/tokens/:tokenId': 'viewer',
  'GET /dev/mailbox': 'any-admin+session',
  'GET /organisations/:organisationId/projects': 'viewer',
  'POST /organisations/:organisationId/projects': 'admin',
  'GET /organisations/:organisationId/projects/:projectId': 'viewer',
  'PATCH /organisations/:organisationId/projects/:projectId': 'admin',
  'DELETE /organisations/:organisationId/projects/:projectId': 'admin',
  'GET /organisations/:organisationId/projects/:projectId/watchers': 'viewer',
  'PUT /organisations/:organisationId/projects/:projectId/watchers/me': 'viewer',
  'DELETE /organisations/:organisationId/projects/:projectId/watchers/me': 'viewer',
  'POST /organisations/:organisationId/projects/:projectId/logs': 'editor',
  'GET /organisations/:organisationId/projects/:projectId/logs': 'viewer',
  'GET /organisations/:organisationId/projects/:projectId/logs/:logId/original': 'viewer',
  'DELETE /organisations/:organisationId/projects/:projectId/logs/:logId': 'admin',
  'GET /organisations/:organisationId/dives': 'viewer',
  'GET /organisations/:organisationId/projects/:projectId/dives': 'viewer',
  'GET /organisations/:organisationId/projects/:projectId/dives/:diveId': 'viewer',
  'GET /organisations/:organisationId/projects/:projectId/dives/:diveId/track': 'viewer',
  'GET /organisations/:organisationId/projects/:projectId/dives/:diveId/report': 'viewer',
  'POST /organisations/:organisationId/projects/:projectId/dives/:diveId/reprocess': 'editor',
  'GET /organisations/:organisationId/projects/:projectId/dives/:diveId/results/:resultId/displacement': 'viewer',
  'GET /organisations/:organisationId/projects/:projectId/logs/:logId/runs': 'viewer',
  'POST /organisations/:organisationId/projects/:projectId/logs/:logId/reprocess': 'editor',
  'GET /organisations/:organisationId/projects/:projectId/dive-archive': 'viewer',
  'POST /convert': 'signed-in',
  'GET /dives/:diveId': 'signed-in',
  // A registry look-up, no organisation's data: anyone signed in, and tokens of any scope.
  'GET /crs': 'signed-in',
  // The background map's tile template: the browser loads the tiles before anyone signs in (previews).
  'GET /site-settings': 'public',
};

const RANK: Record<Role, number> = { viewer: 0, editor: 1, admin: 2 };

function expectedOutcome(route: RouteSpec, p: Principal): 'allowed' | 401 | 403 {
  if (route.access === 'public') return 'allowed';
  if (p.kind === 'anonymous' || (p.kind === 'token' && !p.valid)) return 401;
  if (p.kind === 'token' && route.sessionOnly) return 403;
  if (p.kind === 'token' && p.scope === 'read' && route.method !== 'get') return 403;
  const role: Role | null = p.kind === 'token' ? (p.scope === 'read' ? 'viewer' : p.roleInA) : p.roleInA;
  if (route.access === 'signed-in') return 'allowed';
  if (route.access === 'any-admin') {
    if (p.kind === 'session') return p.adminAnywhere ? 'allowed' : 403;
    return role === 'admin' ? 'allowed' : 403;
  }
  if (role === null) return 403;
  return RANK[role] >= RANK[route.access] ? 'allowed' : 403;
}

describe('authorisation matrix over the route table', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  const tokens = new Map<string, string>();
  const agents = new Map<string, ReturnType<typeof request.agent>>();

  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, {
      rateLimits: { signIn: { windowMs: 60_000, limit: 10_000 }, reset: { windowMs: 60_000, limit: 10_000 } },
    });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'tomas@hollowtide.example', role: 'editor' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]));
    await seedOrganisation(database.db, 'Brinewater Diving', [{ email: 'odile@brinewater.example', role: 'admin' }]);
    for (const p of PRINCIPALS) {
      if (p.kind === 'session') agents.set(p.name, await signedInAgent(testApp, p.email));
      if (p.kind !== 'token') continue;
      const owner = await signedInAgent(testApp, p.tokenOf);
      const created = await owner
        .post(`/api/v1/organisations/${organisationId}/tokens`)
        .set('Sec-Fetch-Site', 'same-origin')
        .send({ name: p.name, scope: p.scope, expiresInDays: 30 })
        .expect(201);
      tokens.set(p.name, created.body.token);
      if (p.name === 'revoked token')
        await owner
          .delete(`/api/v1/organisations/${organisationId}/tokens/${created.body.apiToken.id}`)
          .set('Sec-Fetch-Site', 'same-origin')
          .expect(200);
      if (p.name === 'expired token')
        await database
          .db('api_tokens')
          .where({ id: created.body.apiToken.id })
          .update({ expires_at: new Date(Date.now() - 60_000) });
    }
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('declares for every route the access written down in this test', () => {
    const declared = Object.fromEntries(
      testApp.routes.map((r) => [
        `${r.method.toUpperCase()} ${r.path}`,
        `${r.access}${r.sessionOnly ? '+session' : ''}`,
      ]),
    );
    expect(declared).toEqual(INTENDED_ACCESS);
  });

  it('has routes of every access level in the table', () => {
    const levels = new Set(testApp.routes.map((r) => r.access));
    expect([...levels].sort()).toEqual(['admin', 'any-admin', 'editor', 'public', 'signed-in', 'viewer']);
  });

  it('answers every route for every principal as the access rules say', async () => {
    const failures: string[] = [];
    const needsCheck = new Set<string>();
    let checked = 0;
    for (const route of testApp.routes) {
      // The path's organisation is the one the principals are (or are not) members of; any other id is
      // random, so an allowed call answers 404 or 400 and changes nothing.
      const path = `/api/v1${route.path.replace(/:(\w+)/g, (_m, name: string) =>
        name === 'organisationId' ? organisationId : randomUUID(),
      )}`;
      for (const p of PRINCIPALS) {
        const expected = expectedOutcome(route, p);
        let agent: ReturnType<typeof request.agent> | ReturnType<typeof request>;
        if (p.kind === 'session') {
          // A write that succeeded may have ended the session (signing out): start a fresh one if so.
          const existing = agents.get(p.name);
          const alive =
            existing !== undefined && (!needsCheck.has(p.name) || (await existing.get('/api/v1/me')).status === 200);
          if (!alive) agents.set(p.name, await signedInAgent(testApp, p.email));
          needsCheck.delete(p.name);
          agent = agents.get(p.name) ?? request(testApp.app);
        } else agent = request(testApp.app);
        let call = agent[route.method](path).set('Sec-Fetch-Site', 'same-origin');
        if (p.kind === 'token') call = call.set('Authorization', `Bearer ${tokens.get(p.name)}`);
        if (route.method !== 'get') call = call.send({});
        const response = await call;
        checked++;
        if (route.method !== 'get' && response.status < 300) needsCheck.add(p.name);
        const label = `${route.method.toUpperCase()} ${route.path} as ${p.name}: expected ${expected}, got ${response.status}`;
        if (expected === 'allowed') {
          if ([401, 403].includes(response.status) || response.status >= 500) failures.push(label);
        } else if (response.status !== expected) {
          failures.push(label);
        } else if (response.body?.error?.code !== (expected === 401 ? 'unauthenticated' : 'forbidden')) {
          failures.push(`${label} without the one error body`);
        }
      }
    }
    expect(failures).toEqual([]);
    expect(checked).toBe(testApp.routes.length * PRINCIPALS.length);
  }, 120_000);
});

describe('bad input over the route table', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;

  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, {
      rateLimits: { signIn: { windowMs: 60_000, limit: 10_000 }, reset: { windowMs: 60_000, limit: 10_000 } },
    });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
    ]));
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('never answers 500 to malformed ids, queries or bodies, and always with the one error body', async () => {
    // Even entries keep the real organisation so the request reaches validation; odd ones break it too.
    const badIds = ["1' or '1'='1", 'x'.repeat(300), '%00'];
    const badBodies: Array<{ type: string; raw: string }> = [
      { type: 'application/json', raw: '[]' },
      { type: 'application/json', raw: '"text"' },
      { type: 'application/json', raw: '{"name": {"nested": [1, 2, {"deep": null}]}, "email": 42, "role": "owner"}' },
      { type: 'application/json', raw: '{"unterminated": ' },
      { type: 'text/plain', raw: 'plain words' },
      { type: 'multipart/form-data; boundary=nothing', raw: '--broken' },
    ];
    const failures: string[] = [];
    let admin = await signedInAgent(testApp, 'maren@hollowtide.example');
    let signedOut = false;
    for (const route of testApp.routes) {
      for (const [i, badId] of badIds.entries()) {
        const path = `/api/v1${route.path.replace(/:(\w+)/g, (_m, name: string) =>
          name === 'organisationId' && i % 2 === 0 ? organisationId : badId,
        )}?limit=abc&before=x&to[]=1`;
        for (const body of route.method === 'get' ? [undefined] : badBodies) {
          if (signedOut) admin = await signedInAgent(testApp, 'maren@hollowtide.example');
          signedOut = false;
          let call = admin[route.method](path).set('Sec-Fetch-Site', 'same-origin');
          if (body !== undefined) call = call.set('Content-Type', body.type).send(body.raw);
          const response = await call;
          if (route.method !== 'get' && response.status < 300) signedOut = true;
          const label = `${route.method.toUpperCase()} ${path.slice(0, 80)} ${body?.raw ?? ''} -> ${response.status}`;
          if (response.status >= 500) failures.push(label);
          else if (response.status >= 400 && typeof response.body?.error?.message !== 'string')
            failures.push(`${label} without the one error body`);
        }
      }
    }
    expect(failures).toEqual([]);
  }, 300_000);
});
