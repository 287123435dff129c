import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ArchiveRestoreResult } from '@domain/contracts/archive.ts';
import { ApiError, api, seg } from '../../../lib/api.ts';
import { allProductionsQueryOptions } from './get-productions.ts';
import { usersQueryOptions } from './get-users.ts';

/** The file endings the server takes for a restore. */
export const ARCHIVE_EXTENSIONS = ['.tar.gz', '.tgz'];

/** `GET /api/productions/:id/archive`: a plain link; the browser saves the .tar.gz the server names. */
export function archiveDownloadUrl(productionId: string): string {
  return `/api/productions/${seg(productionId)}/archive`;
}

export interface UploadProgress {
  loadedBytes: number;
  totalBytes: number;
}

/**
 * `POST /api/archive/restore` (multipart, field `archive`) → 201 with what was restored. Sent with
 * XMLHttpRequest, which reports upload progress (fetch cannot); the session cookie and a CSRF token go
 * along as with every change, and a refusal becomes an ApiError with the server's message (which names the
 * entry of the archive at fault).
 */
export async function restoreArchive(file: File, onProgress?: (p: UploadProgress) => void): Promise<ArchiveRestoreResult> {
  const { csrfToken } = await api.get<{ csrfToken: string }>('/auth/csrf');
  const form = new FormData();
  form.append('archive', file, file.name);
  return new Promise<ArchiveRestoreResult>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/archive/restore');
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
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as ArchiveRestoreResult);
      const error = (body as { error?: { code?: string; message?: string; issues?: { path: string; message: string }[] } } | undefined)?.error;
      reject(new ApiError(xhr.status, error?.code ?? `http_${xhr.status}`, error?.message ?? `The restore failed (HTTP ${xhr.status}).`, error?.issues ?? []));
    };
    xhr.send(form);
  });
}

export function useRestoreArchive(onProgress: (p: UploadProgress) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => restoreArchive(file, onProgress),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: allProductionsQueryOptions().queryKey });
      await queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey });
    },
  });
}
