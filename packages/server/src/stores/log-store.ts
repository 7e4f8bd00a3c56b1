import type { Knex } from 'knex';

/** An uploaded file's record, without its bytes. */
export interface LogRecord {
  id: string;
  projectId: string;
  originalFileName: string;
  sha256: string;
  sizeBytes: number;
  detectedFormat: string | null;
  uploadedBy: string | null;
  uploadedAt: Date;
}

/** The archive of original files: bytes kept verbatim, one log per distinct content per project. */
export interface LogStore {
  /**
   * Stores the bytes unless the project already has a log with the same SHA-256; either way returns
   * the log and whether it was created. Safe under concurrent uploads of the same file.
   */
  insertOrFind(input: {
    projectId: string;
    originalFileName: string;
    content: Uint8Array;
    sha256: string;
    detectedFormat: string | null;
    uploadedBy: string;
  }): Promise<{ log: LogRecord; created: boolean }>;
  list(projectId: string): Promise<LogRecord[]>;
  find(projectId: string, logId: string): Promise<LogRecord | undefined>;
  content(projectId: string, logId: string): Promise<Buffer | undefined>;
  delete(projectId: string, logId: string): Promise<boolean>;
}

interface LogRow {
  id: string;
  project_id: string;
  original_file_name: string;
  sha256: string;
  size_bytes: string | number;
  detected_format: string | null;
  uploaded_by: string | null;
  uploaded_at: Date;
}

const COLUMNS = [
  'id',
  'project_id',
  'original_file_name',
  'sha256',
  'size_bytes',
  'detected_format',
  'uploaded_by',
  'uploaded_at',
];

function toRecord(row: LogRow): LogRecord {
  return {
    id: row.id,
    projectId: row.project_id,
    originalFileName: row.original_file_name,
    sha256: row.sha256,
    sizeBytes: Number(row.size_bytes),
    detectedFormat: row.detected_format,
    uploadedBy: row.uploaded_by,
    uploadedAt: row.uploaded_at,
  };
}

/** The PostgreSQL implementation. */
export function createKnexLogStore(db: Knex): LogStore {
  return {
    async insertOrFind(input) {
      const [inserted] = await db('logs')
        .insert({
          project_id: input.projectId,
          original_file_name: input.originalFileName,
          content: Buffer.from(input.content.buffer, input.content.byteOffset, input.content.byteLength),
          sha256: input.sha256,
          size_bytes: input.content.byteLength,
          detected_format: input.detectedFormat,
          uploaded_by: input.uploadedBy,
        })
        .onConflict(['project_id', 'sha256'])
        .ignore()
        .returning<LogRow[]>(COLUMNS);
      if (inserted !== undefined) return { log: toRecord(inserted), created: true };
      const existing: LogRow | undefined = await db('logs')
        .where({ project_id: input.projectId, sha256: input.sha256 })
        .first(COLUMNS);
      if (existing === undefined) throw new Error('a log with this SHA-256 was neither inserted nor found');
      return { log: toRecord(existing), created: false };
    },
    async list(projectId) {
      const rows: LogRow[] = await db('logs')
        .where({ project_id: projectId })
        .select(COLUMNS)
        .orderBy('uploaded_at', 'desc');
      return rows.map(toRecord);
    },
    async find(projectId, logId) {
      const row: LogRow | undefined = await db('logs').where({ project_id: projectId, id: logId }).first(COLUMNS);
      return row === undefined ? undefined : toRecord(row);
    },
    async content(projectId, logId) {
      const row: { content: Buffer } | undefined = await db('logs')
        .where({ project_id: projectId, id: logId })
        .first('content');
      return row?.content;
    },
    async delete(projectId, logId) {
      return (await db('logs').where({ project_id: projectId, id: logId }).delete()) > 0;
    },
  };
}
