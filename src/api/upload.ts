// File uploads with progress. fetch cannot report upload progress, so this is the one place that
// uses XMLHttpRequest; it answers exactly like apiRequest (shared schema, ApiError).
import type { z } from 'zod';
import { apiUrl, errorFromResponse, parseSuccess } from './client';
import { ApiError, NETWORK_MESSAGE } from './errors';

/** A browser File/Blob, or (native builds) a local file by uri. */
export type UploadFile = Blob | { uri: string; name: string; type: string };

export interface UploadOptions {
  file: UploadFile;
  /** File name sent with a Blob (a File keeps its own). */
  fileName?: string;
  /** Multipart field name of the file; 'file' unless the route says otherwise. */
  fieldName?: string;
  /** Extra text fields sent with the file. */
  fields?: Record<string, string>;
  /** Called with 0..1 as bytes go out. */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
  method?: 'POST' | 'PUT';
}

/** What expo-image-picker gives (web: `file` is set; native: `uri`, `fileName`, `mimeType`). */
export function uploadFileFromAsset(asset: { uri: string; file?: File; fileName?: string | null; mimeType?: string | null }): UploadFile {
  if (asset.file) return asset.file;
  return { uri: asset.uri, name: asset.fileName ?? 'upload', type: asset.mimeType ?? 'application/octet-stream' };
}

export class UploadAbortedError extends Error {
  constructor() {
    super('Upload cancelled');
    this.name = 'AbortError';
  }
}

export function uploadWithProgress<S extends z.ZodType>(path: string, schema: S, opts: UploadOptions): Promise<z.output<S>> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    for (const [k, v] of Object.entries(opts.fields ?? {})) form.append(k, v);
    const field = opts.fieldName ?? 'file';
    if (typeof Blob !== 'undefined' && opts.file instanceof Blob) {
      const name = opts.fileName ?? ((opts.file as File).name || 'upload');
      form.append(field, opts.file, name);
    } else {
      // React Native's FormData takes { uri, name, type } for a local file.
      form.append(field, opts.file as unknown as Blob);
    }

    const xhr = new XMLHttpRequest();
    xhr.open(opts.method ?? 'POST', apiUrl(path));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (ev) => {
      if (ev.lengthComputable && ev.total > 0) opts.onProgress?.(Math.min(1, ev.loaded / ev.total));
    };
    xhr.onload = () => {
      const text = typeof xhr.responseText === 'string' ? xhr.responseText : '';
      if (xhr.status < 200 || xhr.status >= 300) return reject(errorFromResponse(xhr.status, text));
      try {
        opts.onProgress?.(1);
        resolve(parseSuccess(xhr.status, text, schema) as z.output<S>);
      } catch (e) {
        reject(e instanceof Error ? e : new Error(String(e)));
      }
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', NETWORK_MESSAGE));
    xhr.ontimeout = () => reject(new ApiError(0, 'network', NETWORK_MESSAGE));
    xhr.onabort = () => reject(new UploadAbortedError());
    if (opts.signal) {
      if (opts.signal.aborted) return reject(new UploadAbortedError());
      opts.signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}
