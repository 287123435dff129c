import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ArchiveRestoreResult } from '@domain/contracts/archive.ts';
import { seg } from '../../../lib/api.ts';
import { uploadFile, type UploadProgress } from '../../../lib/upload.ts';
import { allProductionsQueryOptions } from './get-productions.ts';
import { usersQueryOptions } from './get-users.ts';

export type { UploadProgress };

/** The file endings the server takes for a restore. */
export const ARCHIVE_EXTENSIONS = ['.tar.gz', '.tgz'];

/** `GET /api/productions/:id/archive`: a plain link; the browser saves the .tar.gz the server names. */
export function archiveDownloadUrl(productionId: string): string {
  return `/api/productions/${seg(productionId)}/archive`;
}

/**
 * `POST /api/archive/restore` (multipart, field `archive`) → 201 with what was restored, with upload progress;
 * a refusal becomes an ApiError with the server's message (which names the entry of the archive at fault).
 */
export function restoreArchive(file: File, onProgress?: (p: UploadProgress) => void): Promise<ArchiveRestoreResult> {
  return uploadFile<ArchiveRestoreResult>('/archive/restore', file, file.name, {}, onProgress, 'archive');
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
