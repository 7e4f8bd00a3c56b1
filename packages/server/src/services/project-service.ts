import { createHash } from 'node:crypto';
import {
  detectFormat,
  formatRejection,
  type LogFormat,
  parseCrsCode,
  type RejectionCode,
  readLog,
  resolveCrs,
} from '@leadline/core';
import { AppError } from '../http/errors.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { LogRecord, LogStore } from '../stores/log-store.js';
import type { ProjectFields, ProjectRecord, ProjectStore } from '../stores/project-store.js';

interface Deps {
  projects: ProjectStore;
  logs: LogStore;
  activity: ActivityStore;
  /** Called once for each newly archived log (queues its processing). */
  onLogCreated?:
    | ((log: LogRecord, input: { organisationId: string; actorUserId: string }) => Promise<unknown>)
    | undefined;
}

/** Normalises and checks a project's time zone (IANA) and CRS (an EPSG code core can resolve); 422 otherwise. */
function checkSettings(fields: Partial<ProjectFields>): Partial<ProjectFields> {
  const checked = { ...fields };
  if (fields.timeZone !== undefined) {
    try {
      checked.timeZone = new Intl.DateTimeFormat('en', { timeZone: fields.timeZone }).resolvedOptions().timeZone;
    } catch {
      throw new AppError(
        'unprocessable',
        `"${fields.timeZone}" is not a time zone; use an IANA name such as Europe/Oslo.`,
      );
    }
  }
  if (fields.defaultCrs !== undefined && fields.defaultCrs !== null) {
    const code = parseCrsCode(fields.defaultCrs);
    try {
      if (code === undefined) throw new Error(`"${fields.defaultCrs}" is not a CRS code; expected EPSG:<number>`);
      resolveCrs(code);
    } catch (error) {
      throw new AppError('unprocessable', error instanceof Error ? error.message : String(error), {
        field: 'defaultCrs',
      });
    }
    checked.defaultCrs = `EPSG:${code}`;
  }
  return checked;
}

/** The organisation's projects by name. */
export function listProjects(deps: Deps, organisationId: string): Promise<ProjectRecord[]> {
  return deps.projects.list(organisationId);
}

/** One project; 404 when it is not in this organisation. */
export async function getProject(deps: Deps, organisationId: string, projectId: string): Promise<ProjectRecord> {
  const project = await deps.projects.find(organisationId, projectId);
  if (project === undefined) throw new AppError('not-found', `No project ${projectId} in this organisation.`);
  return project;
}

/** Creates a project; 409 when the name is taken in the organisation. */
export async function createProject(
  deps: Deps,
  input: { organisationId: string; actorUserId: string; fields: ProjectFields },
): Promise<ProjectRecord> {
  const fields = { ...input.fields, ...checkSettings(input.fields) };
  const project = await deps.projects.create(input.organisationId, fields);
  if (project === undefined) throw new AppError('conflict', `A project named "${fields.name}" already exists.`);
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'project-created',
    subjectType: 'project',
    subjectId: project.id,
    details: { name: project.name },
  });
  return project;
}

/** Changes a project's settings. */
export async function updateProject(
  deps: Deps,
  input: { organisationId: string; projectId: string; actorUserId: string; fields: Partial<ProjectFields> },
): Promise<ProjectRecord> {
  const result = await deps.projects.update(input.organisationId, input.projectId, checkSettings(input.fields));
  if (result === 'missing') throw new AppError('not-found', `No project ${input.projectId} in this organisation.`);
  if (result === 'duplicate-name')
    throw new AppError('conflict', `A project named "${input.fields.name}" already exists.`);
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'project-updated',
    subjectType: 'project',
    subjectId: input.projectId,
    details: { fields: Object.keys(input.fields).sort() },
  });
  return getProject(deps, input.organisationId, input.projectId);
}

/** Deletes a project with all its logs. */
export async function deleteProject(
  deps: Deps,
  input: { organisationId: string; projectId: string; actorUserId: string },
): Promise<void> {
  const project = await getProject(deps, input.organisationId, input.projectId);
  await deps.projects.delete(input.organisationId, input.projectId);
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'project-deleted',
    subjectType: 'project',
    subjectId: project.id,
    details: { name: project.name, logCount: project.logCount },
  });
}

/** Reasons the readers give for refusing a file as a whole (hostile or unreadable); such a file is not archived. */
const WHOLE_FILE_CODES: ReadonlySet<RejectionCode> = new Set([
  'empty-file',
  'binary-content',
  'unsupported-encoding',
  'unknown-format',
  'malformed-xml',
  'forbidden-xml-construct',
]);

/** The readers' whole-file refusal of an upload, if any; row-level problems are left to processing. */
function refuseWholeFile(file: {
  fileName: string;
  content: Uint8Array;
}): { code: string; message: string } | undefined {
  if (file.content.byteLength === 0) return { code: 'empty-file', message: `${file.fileName}: the file is empty.` };
  const format: LogFormat | undefined = detectFormat({ fileName: file.fileName, content: file.content });
  let result: ReturnType<typeof readLog>;
  try {
    result = readLog({ fileName: file.fileName, content: file.content }, format === undefined ? {} : { format });
  } catch {
    // A reader that throws is a bug, not the file's fault: archive it; processing will report the failure.
    return undefined;
  }
  const [first] = result.rejections;
  if (result.tracks.length > 0 || result.waypoints.length > 0 || first === undefined) return undefined;
  if (!WHOLE_FILE_CODES.has(first.code) || result.rejections.length !== 1) return undefined;
  return { code: first.code, message: formatRejection(first) };
}

/** The outcome of one uploaded file. */
export type UploadResult =
  | { fileName: string; status: 'created' | 'existing'; log: LogRecord }
  | { fileName: string; status: 'rejected'; error: { code: string; message: string } };

/**
 * Archives uploaded files verbatim with their SHA-256. The same bytes in the same project return the
 * existing log; a file that is empty or not a log format Leadline reads is rejected with a reason and
 * not stored.
 */
export async function uploadLogs(
  deps: Deps,
  input: {
    organisationId: string;
    projectId: string;
    actorUserId: string;
    /** `sha256` when the upload already hashed the bytes as they streamed in. */
    files: Array<{ fileName: string; content: Uint8Array; sha256?: string | undefined }>;
  },
): Promise<UploadResult[]> {
  await getProject(deps, input.organisationId, input.projectId);
  const results: UploadResult[] = [];
  for (const file of input.files) {
    const refused = refuseWholeFile(file);
    if (refused !== undefined) {
      results.push({ fileName: file.fileName, status: 'rejected', error: refused });
      continue;
    }
    const format = detectFormat({ fileName: file.fileName, content: file.content }) ?? null;
    const sha256 = file.sha256 ?? createHash('sha256').update(file.content).digest('hex');
    const { log, created } = await deps.logs.insertOrFind({
      projectId: input.projectId,
      originalFileName: file.fileName,
      content: file.content,
      sha256,
      detectedFormat: format,
      uploadedBy: input.actorUserId,
    });
    if (created)
      await deps.activity.append({
        organisationId: input.organisationId,
        actorUserId: input.actorUserId,
        action: 'log-uploaded',
        subjectType: 'log',
        subjectId: log.id,
        details: { projectId: input.projectId, fileName: file.fileName, sha256, sizeBytes: log.sizeBytes },
      });
    if (created) await deps.onLogCreated?.(log, input);
    results.push({ fileName: file.fileName, status: created ? 'created' : 'existing', log });
  }
  return results;
}

/** A project's logs, newest first. */
export async function listLogs(deps: Deps, organisationId: string, projectId: string): Promise<LogRecord[]> {
  await getProject(deps, organisationId, projectId);
  return deps.logs.list(projectId);
}

/** One log's record and its original bytes. */
export async function getLogOriginal(
  deps: Deps,
  input: { organisationId: string; projectId: string; logId: string },
): Promise<{ log: LogRecord; content: Buffer }> {
  await getProject(deps, input.organisationId, input.projectId);
  const log = await deps.logs.find(input.projectId, input.logId);
  const content = await deps.logs.content(input.projectId, input.logId);
  if (log === undefined || content === undefined)
    throw new AppError('not-found', `No log ${input.logId} in this project.`);
  return { log, content };
}

/** Deletes a log and what was derived from it. */
export async function deleteLog(
  deps: Deps,
  input: { organisationId: string; projectId: string; logId: string; actorUserId: string },
): Promise<void> {
  await getProject(deps, input.organisationId, input.projectId);
  const log = await deps.logs.find(input.projectId, input.logId);
  if (log === undefined || !(await deps.logs.delete(input.projectId, input.logId)))
    throw new AppError('not-found', `No log ${input.logId} in this project.`);
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'log-deleted',
    subjectType: 'log',
    subjectId: log.id,
    details: { projectId: input.projectId, fileName: log.originalFileName, sha256: log.sha256 },
  });
}
