import { resolveSetupSchema } from '@leadline/core';
import { z } from 'zod';
import { requireMembership } from '../http/authorise.js';
import { AppError } from '../http/errors.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import {
  createProject,
  deleteLog,
  deleteProject,
  getLogOriginal,
  getProject,
  listLogs,
  listProjects,
  updateProject,
  uploadLogs,
} from '../services/project-service.js';
import type { ServiceContext } from '../services/service-context.js';
import type { LogRecord, LogStore } from '../stores/log-store.js';
import type { ProjectStore } from '../stores/project-store.js';
import { OrganisationParams, TimestampSchema, UuidSchema } from './schemas.js';

const ProjectParams = OrganisationParams.extend({ projectId: UuidSchema });
const LogParams = ProjectParams.extend({ logId: UuidSchema });

const optionalText = z.string().trim().min(1).max(200).nullable();
const ProjectFieldsSchema = z.object({
  name: z.string().trim().min(1).max(200),
  client: optionalText.default(null),
  site: optionalText.default(null),
  timeZone: z.string().min(1).max(64).default('UTC').describe('IANA time zone, e.g. Europe/Oslo'),
  defaultCrs: z.string().max(20).nullable().default(null).describe('EPSG code, e.g. EPSG:25832'),
  auditProfile: z
    .string()
    .regex(/^[a-z][a-z0-9-]{0,63}$/, 'a profile name such as inspection-rov')
    .default('inspection-rov')
    .describe('Preset: inspection-rov, work-rov, diver, towed-body; or a user-defined profile name'),
  defaultSetup: resolveSetupSchema.nullable().default(null).describe('The re-solve setup used by default'),
});

const ProjectSchema = z.object({
  id: UuidSchema,
  name: z.string(),
  client: z.string().nullable(),
  site: z.string().nullable(),
  timeZone: z.string(),
  defaultCrs: z.string().nullable(),
  auditProfile: z.string(),
  defaultSetup: z.unknown(),
  logCount: z.number().int(),
  createdAt: TimestampSchema,
  updatedAt: TimestampSchema,
});

const LogSchema = z.object({
  id: UuidSchema,
  projectId: UuidSchema,
  originalFileName: z.string(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  sizeBytes: z.number().int(),
  detectedFormat: z.string().nullable(),
  uploadedBy: UuidSchema.nullable(),
  uploadedAt: TimestampSchema,
});

const UploadResultSchema = z.object({
  fileName: z.string(),
  status: z.enum(['created', 'existing', 'rejected']),
  log: LogSchema.optional(),
  error: z.object({ code: z.string(), message: z.string() }).optional(),
});

/** What the project routes need beyond the shared context. */
export interface ProjectRouteStores {
  projects: ProjectStore;
  logs: LogStore;
  /** Called once for each newly archived log (queues its processing). */
  onLogCreated?: (log: LogRecord, input: { organisationId: string; actorUserId: string }) => Promise<unknown>;
}

function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

/** Projects of an organisation, their watchers and the archive of uploaded logs. */
export function createProjectRoutes(ctx: ServiceContext, stores: ProjectRouteStores): RouteSpec[] {
  const deps = { ...stores, activity: ctx.activity };
  return [
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects',
      summary: "The organisation's projects by name",
      tag: 'Projects',
      access: 'viewer',
      params: OrganisationParams,
      responses: { 200: { description: 'Projects', schema: z.object({ projects: z.array(ProjectSchema) }) } },
      async handler({ auth }, _req, res) {
        const projects = await listProjects(deps, requireMembership(auth).organisationId);
        res.json({ projects: projects.map(({ organisationId: _o, ...p }) => p) });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/organisations/:organisationId/projects',
      summary: 'Create a project',
      tag: 'Projects',
      access: 'admin',
      params: OrganisationParams,
      body: ProjectFieldsSchema,
      responses: {
        201: { description: 'Created', schema: z.object({ project: ProjectSchema }) },
        409: { description: 'The name is taken' },
        422: { description: 'Unknown time zone or CRS' },
      },
      async handler({ body, auth }, _req, res) {
        const me = requireMembership(auth);
        const { organisationId: _o, ...project } = await createProject(deps, {
          organisationId: me.organisationId,
          actorUserId: me.userId,
          fields: body,
        });
        res.status(201).json({ project });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId',
      summary: 'One project with its settings',
      tag: 'Projects',
      access: 'viewer',
      params: ProjectParams,
      responses: { 200: { description: 'The project', schema: z.object({ project: ProjectSchema }) } },
      async handler({ params, auth }, _req, res) {
        const { organisationId: _o, ...project } = await getProject(
          deps,
          requireMembership(auth).organisationId,
          params.projectId,
        );
        res.json({ project });
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/organisations/:organisationId/projects/:projectId',
      summary: "Change a project's name, client, site, time zone, CRS, audit profile or default setup",
      tag: 'Projects',
      access: 'admin',
      params: ProjectParams,
      body: ProjectFieldsSchema.partial()
        .strict()
        .refine((fields) => Object.keys(fields).length > 0, 'Name at least one field to change.'),
      responses: {
        200: { description: 'Changed', schema: z.object({ project: ProjectSchema }) },
        409: { description: 'The name is taken' },
        422: { description: 'Unknown time zone or CRS' },
      },
      async handler({ params, body, auth }, _req, res) {
        const me = requireMembership(auth);
        const { organisationId: _o, ...project } = await updateProject(deps, {
          organisationId: me.organisationId,
          projectId: params.projectId,
          actorUserId: me.userId,
          fields: body,
        });
        res.json({ project });
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/organisations/:organisationId/projects/:projectId',
      summary: 'Delete a project with all its logs',
      tag: 'Projects',
      access: 'admin',
      params: ProjectParams,
      responses: { 204: { description: 'Deleted' } },
      async handler({ params, auth }, _req, res) {
        const me = requireMembership(auth);
        await deleteProject(deps, {
          organisationId: me.organisationId,
          projectId: params.projectId,
          actorUserId: me.userId,
        });
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/watchers',
      summary: "Who receives the project's failed-audit notices",
      tag: 'Projects',
      access: 'viewer',
      params: ProjectParams,
      responses: {
        200: {
          description: 'Watchers',
          schema: z.object({
            watchers: z.array(z.object({ userId: UuidSchema, email: z.string(), displayName: z.string() })),
          }),
        },
      },
      async handler({ params, auth }, _req, res) {
        await getProject(deps, requireMembership(auth).organisationId, params.projectId);
        res.json({ watchers: await stores.projects.watchers(params.projectId) });
      },
    }),
    defineRoute({
      method: 'put',
      path: '/organisations/:organisationId/projects/:projectId/watchers/me',
      summary: 'Watch the project: receive its failed-audit notices',
      tag: 'Projects',
      access: 'viewer',
      params: ProjectParams,
      responses: { 204: { description: 'Watching' } },
      async handler({ params, auth }, _req, res) {
        const me = requireMembership(auth);
        await getProject(deps, me.organisationId, params.projectId);
        await stores.projects.setWatching(params.projectId, me.userId, true);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/organisations/:organisationId/projects/:projectId/watchers/me',
      summary: 'Stop watching the project',
      tag: 'Projects',
      access: 'viewer',
      params: ProjectParams,
      responses: { 204: { description: 'Not watching' } },
      async handler({ params, auth }, _req, res) {
        const me = requireMembership(auth);
        await getProject(deps, me.organisationId, params.projectId);
        await stores.projects.setWatching(params.projectId, me.userId, false);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/organisations/:organisationId/projects/:projectId/logs',
      summary:
        'Upload one or many log files (multipart field "files"); the bytes are kept verbatim, and the same file again returns the existing log',
      tag: 'Logs',
      access: 'editor',
      params: ProjectParams,
      upload: { field: 'files', maxFiles: 50 },
      responses: {
        201: { description: 'At least one new log', schema: z.object({ results: z.array(UploadResultSchema) }) },
        200: {
          description: 'Every file was already archived',
          schema: z.object({ results: z.array(UploadResultSchema) }),
        },
        422: { description: 'No file was a readable log', schema: z.object({ results: z.array(UploadResultSchema) }) },
      },
      async handler({ params, auth, files }, _req, res) {
        const me = requireMembership(auth);
        if (files.length === 0)
          throw new AppError('bad-request', 'Send the files as multipart/form-data in the field "files".');
        const results = await uploadLogs(deps, {
          organisationId: me.organisationId,
          projectId: params.projectId,
          actorUserId: me.userId,
          files: files.map((f) => ({ fileName: f.originalname, content: f.buffer, sha256: f.sha256 })),
        });
        const status = results.some((r) => r.status === 'created')
          ? 201
          : results.every((r) => r.status === 'rejected')
            ? 422
            : 200;
        res.status(status).json({ results });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/logs',
      summary: "The project's logs, newest first",
      tag: 'Logs',
      access: 'viewer',
      params: ProjectParams,
      responses: { 200: { description: 'Logs', schema: z.object({ logs: z.array(LogSchema) }) } },
      async handler({ params, auth }, _req, res) {
        res.json({ logs: await listLogs(deps, requireMembership(auth).organisationId, params.projectId) });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/logs/:logId/original',
      summary: 'The original file, byte for byte, under its uploaded name',
      tag: 'Logs',
      access: 'viewer',
      params: LogParams,
      responses: { 200: { description: 'The original bytes', contentType: 'application/octet-stream' } },
      async handler({ params, auth }, _req, res) {
        const { log, content } = await getLogOriginal(deps, {
          organisationId: requireMembership(auth).organisationId,
          projectId: params.projectId,
          logId: params.logId,
        });
        res.setHeader('Content-Type', 'application/octet-stream');
        res.setHeader('Content-Disposition', contentDisposition(log.originalFileName));
        res.setHeader('ETag', `"${log.sha256}"`);
        res.setHeader('Digest', `sha-256=${Buffer.from(log.sha256, 'hex').toString('base64')}`);
        res.end(content);
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/organisations/:organisationId/projects/:projectId/logs/:logId',
      summary: 'Delete a log and everything derived from it',
      tag: 'Logs',
      access: 'admin',
      params: LogParams,
      responses: { 204: { description: 'Deleted' } },
      async handler({ params, auth }, _req, res) {
        const me = requireMembership(auth);
        await deleteLog(deps, {
          organisationId: me.organisationId,
          projectId: params.projectId,
          logId: params.logId,
          actorUserId: me.userId,
        });
        res.status(204).end();
      },
    }),
  ];
}
