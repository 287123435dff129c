import { ApiError, api } from './api.ts';

export interface UploadProgress {
  loadedBytes: number;
  totalBytes: number;
}

/** How much of an upload has gone, 0 to 1 (0 while the size is not known). */
export function uploadedShare(p: UploadProgress | null): number {
  return p && p.totalBytes > 0 ? Math.min(1, p.loadedBytes / p.totalBytes) : 0;
}

/**
 * Sends a multipart form with one file and reports upload progress (fetch cannot report it; XMLHttpRequest
 * can). Carries the session cookie and a CSRF token like every other change; errors become ApiError with the
 * server's message (limits and types named there). Used by every upload: parts lists, meshes, archives.
 */
export async function uploadFile<T>(
  path: string,
  file: File | Blob,
  fileName: string,
  fields: Record<string, string>,
  onProgress?: (p: UploadProgress) => void,
  fieldName = 'file',
): Promise<T> {
  const { csrfToken } = await api.get<{ csrfToken: string }>('/auth/csrf');
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append(fieldName, file, fileName);
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api${path}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('x-csrf-token', csrfToken);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (e) => onProgress?.({ loadedBytes: e.loaded, totalBytes: e.lengthComputable ? e.total : file.size });
    xhr.onerror = () => reject(new ApiError(0, 'network', 'Ballast cannot be reached. Check your connection and try again.'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        // Not JSON (a proxy's error page): the status tells enough.
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as T);
      const error = (body as { error?: { code?: string; message?: string; issues?: { path: string; message: string }[] } } | undefined)?.error;
      reject(new ApiError(xhr.status, error?.code ?? `http_${xhr.status}`, error?.message ?? `The upload failed (HTTP ${xhr.status}).`, error?.issues ?? []));
    };
    xhr.send(form);
  });
}
