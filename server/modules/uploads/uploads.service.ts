import type { FileStorage } from '../../integrations/storage';
import { AppError } from '../../lib/app-error';
import type { UploadsRepo } from './uploads.repo';

export interface ServedUpload {
  path: string;
  contentType: string;
  /** Photos show inline; a spec sheet is a download under this name. */
  downloadName?: string;
}

/** A download name of ASCII letters, digits, dot, dash, underscore and space: nothing a header or a file system reads specially. */
function safeFileName(name: string, extension: string): string {
  const cleaned = name
    .replace(/[^\w .-]/g, '_')
    .replace(/^[.\s]+/, '')
    .slice(0, 100)
    .trim();
  return cleaned.toLowerCase().endsWith(`.${extension}`) ? cleaned : `${cleaned || 'file'}.${extension}`;
}

export function createUploadsService(repo: UploadsRepo, storage: FileStorage) {
  return {
    async get(id: string): Promise<ServedUpload> {
      const row = await repo.findById(id);
      if (!row) throw new AppError(404, 'upload_not_found', 'No such file.');
      const file = { path: storage.pathOf(row.storageKey), contentType: row.contentType };
      return row.kind === 'photo' ? file : { ...file, downloadName: safeFileName(row.originalName, 'pdf') };
    },
  };
}

export type UploadsService = ReturnType<typeof createUploadsService>;
