import { ApiError, type ApiErrorBody } from '../../../lib/api-client';

/** The server's answer for one uploaded file (its `UploadResultSchema`). */
export interface UploadResult {
  fileName: string;
  status: 'created' | 'existing' | 'rejected';
  log?: { id: string; projectId: string; originalFileName: string; sizeBytes: number; sha256: string };
  error?: { code: string; message: string };
}

/** What an upload in flight reports. */
export interface UploadProgress {
  loadedBytes: number;
  totalBytes: number;
}

function parseBody(text: string): unknown {
  try {
    return text === '' ? undefined : JSON.parse(text);
  } catch {
    return undefined;
  }
}

/**
 * Sends one file to `POST …/projects/:projectId/logs` (multipart field `files`) with
 * XMLHttpRequest, whose upload events report progress (fetch has none). Resolves with the
 * server's result for the file, also when it was refused as unreadable (422 carries results);
 * rejects with `ApiError` for any other failure (413 too large, 403 role, network: status 0).
 */
export function uploadLogFile(
  input: { organisationId: string; projectId: string; file: File },
  onProgress: (progress: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<UploadResult> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const url = `/api/v1/organisations/${encodeURIComponent(input.organisationId)}/projects/${encodeURIComponent(input.projectId)}/logs`;
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    let sentBytes = 0;
    xhr.upload.onprogress = (event) => {
      sentBytes = event.loaded;
      onProgress({ loadedBytes: event.loaded, totalBytes: event.lengthComputable ? event.total : input.file.size });
    };
    xhr.onload = () => {
      const body = parseBody(xhr.responseText) as (Partial<ApiErrorBody> & { results?: UploadResult[] }) | undefined;
      const result = body?.results?.[0];
      if ((xhr.status === 200 || xhr.status === 201 || xhr.status === 422) && result !== undefined) {
        resolve(result);
        return;
      }
      if (xhr.status === 413) {
        reject(
          new ApiError(413, {
            code: 'payload-too-large',
            message: body?.error?.message ?? 'The file is larger than the server accepts.',
          }),
        );
        return;
      }
      reject(
        new ApiError(xhr.status, body?.error ?? { code: 'http-error', message: `The server answered ${xhr.status}.` }),
      );
    };
    xhr.onerror = () =>
      reject(
        new ApiError(0, {
          code: 'network',
          // A server refusing a file over its size limit may close the connection before the browser
          // reads its 413, so a cut-off upload says that possibility too.
          message:
            sentBytes > 0 && sentBytes < input.file.size
              ? 'The connection closed before the whole file was sent: the file may be over the server’s size limit, or the network dropped.'
              : 'The upload did not reach the server (network error).',
        }),
      );
    xhr.onabort = () => reject(new ApiError(0, { code: 'aborted', message: 'The upload was cancelled.' }));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    const form = new FormData();
    form.append('files', input.file, input.file.name);
    xhr.send(form);
  });
}
