/**
 * Sending a sculpt file to the server with real upload progress (XMLHttpRequest's upload.onprogress; fetch
 * cannot report request-body progress), after checks that catch a wrong or oversized file before any byte
 * leaves the machine.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useRef, useState } from 'react';
import type { SculptUploadFields } from '../db/validation-sculpts';
import { ApiError, apiErrorFromResponse } from './api-client';
import { buildsQueryKey } from './use-builds';
import { sculptEnvelopeSchema, sculptsPath, sculptsQueryKey, type Sculpt } from './use-sculpts';

/** Largest sculpt file accepted: 200 MB (DESIGN.md step 1, "Sculpt in"), counted as 200 × 1024 × 1024 bytes. */
export const MAX_SCULPT_BYTES = 200 * 1024 * 1024;

/** File name endings the upload accepts (the server then checks the content itself). */
export const SCULPT_EXTENSIONS = ['obj', 'stl', 'ply'] as const;

/** Returns `bytes` as a size people read: "812 B", "14.2 kB", "3.4 MB" (powers of 1024, one decimal). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/**
 * Returns what is wrong with a file named `name` of `sizeBytes` bytes as a sculpt upload, or null when it may
 * be sent: an empty file, a file over MAX_SCULPT_BYTES, or a name not ending in .obj, .stl or .ply (any case).
 * Each message names the file and what to do.
 */
export function checkSculptFile(name: string, sizeBytes: number): string | null {
  const ext = /\.([^.]+)$/.exec(name)?.[1]?.toLowerCase() ?? '';
  if (!(SCULPT_EXTENSIONS as readonly string[]).includes(ext)) {
    return `“${name}” is not a model file Sheetsmith reads: choose an .obj, .stl or .ply file${ext ? ` (this one ends in .${ext})` : ''}.`;
  }
  if (sizeBytes === 0) return `“${name}” is empty (0 bytes): export the model again and choose the new file.`;
  if (sizeBytes > MAX_SCULPT_BYTES) {
    return `“${name}” is ${formatBytes(sizeBytes)}; the most a sculpt may be is ${formatBytes(MAX_SCULPT_BYTES)}. Reduce it in your modelling tool (fewer triangles, or binary STL/PLY instead of text) and try again.`;
  }
  return null;
}

/** The upload form's fields as the multipart request sends them (numbers as decimal text, absent ones left out). */
export function uploadFormFields(fields: SculptUploadFields): [string, string][] {
  const out: [string, string][] = [['units', fields.units]];
  for (const key of ['scale', 'headCircumferenceMm', 'headHeightMm', 'targetTriangles'] as const) {
    const v = fields[key];
    if (v !== undefined) out.push([key, String(v)]);
  }
  return out;
}

/** Where an upload is: not started, sending (`sent` of `total` bytes), waiting for the server's answer, done, failed. */
export type UploadState =
  | { phase: 'idle' }
  | { phase: 'sending'; sent: number; total: number }
  | { phase: 'waiting' }
  | { phase: 'done'; sculpt: Sculpt }
  | { phase: 'failed'; error: ApiError };

/**
 * Sends `file` with `fields` to POST .../sculpts as multipart form data and resolves to the new SculptView (202).
 * `onProgress(sent, total)` follows the request body. Rejects with ApiError: the server's error (its message
 * says what is wrong), NETWORK when the connection fails, ABORTED when `signal` aborts, BAD_RESPONSE for an
 * answer that is not a SculptView.
 */
export function uploadSculpt(
  shopId: string,
  buildId: string,
  file: Blob & { name: string },
  fields: SculptUploadFields,
  onProgress: (sent: number, total: number) => void,
  signal?: AbortSignal,
): Promise<Sculpt> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    for (const [k, v] of uploadFormFields(fields)) form.append(k, v);
    form.append('file', file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', sculptsPath(shopId, buildId));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => onProgress(e.loaded, e.lengthComputable ? e.total : file.size);
    xhr.onerror = () => reject(new ApiError(0, 'NETWORK', 'The upload broke off: the Sheetsmith server could not be reached. Check your connection and try again.'));
    xhr.onabort = () => reject(new ApiError(0, 'ABORTED', 'The upload was cancelled.'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        body = undefined;
      }
      if (xhr.status < 200 || xhr.status >= 300) {
        reject(apiErrorFromResponse(xhr.status, body));
        return;
      }
      const parsed = sculptEnvelopeSchema.safeParse(body);
      if (!parsed.success) {
        reject(new ApiError(xhr.status, 'BAD_RESPONSE', `The server's answer to the upload was not understood (${parsed.error.issues[0]?.path.join('.') || 'the body'}).`));
        return;
      }
      resolve(parsed.data.sculpt);
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/**
 * The upload page's sender: `start(file, fields)` sends the file and tracks UploadState; `cancel()` aborts a
 * running upload. On success the build's sculpt list and the builds list are refreshed.
 */
export function useSculptUpload(shopId: string, buildId: string) {
  const qc = useQueryClient();
  const [state, setState] = useState<UploadState>({ phase: 'idle' });
  const abort = useRef<AbortController | null>(null);
  const start = useCallback(
    async (file: Blob & { name: string }, fields: SculptUploadFields) => {
      abort.current?.abort();
      const ctrl = new AbortController();
      abort.current = ctrl;
      setState({ phase: 'sending', sent: 0, total: file.size });
      try {
        const sculpt = await uploadSculpt(
          shopId,
          buildId,
          file,
          fields,
          (sent, total) => setState(sent >= total ? { phase: 'waiting' } : { phase: 'sending', sent, total }),
          ctrl.signal,
        );
        setState({ phase: 'done', sculpt });
        void qc.invalidateQueries({ queryKey: sculptsQueryKey(shopId, buildId) });
        void qc.invalidateQueries({ queryKey: buildsQueryKey(shopId), exact: true });
        return sculpt;
      } catch (e) {
        const error = e instanceof ApiError ? e : new ApiError(0, 'UPLOAD', `The upload failed: ${String(e)}`);
        setState({ phase: 'failed', error });
        return null;
      }
    },
    [shopId, buildId, qc],
  );
  const cancel = useCallback(() => abort.current?.abort(), []);
  const reset = useCallback(() => setState({ phase: 'idle' }), []);
  return { state, start, cancel, reset };
}
