import type { FileStorage } from '../../integrations/storage';
import { AppError } from '../../lib/app-error';
import type { UploadsRepo } from './uploads.repo';

export interface ServedUpload {
  path: string;
  contentType: string;
  /** The Content-Disposition header: images inline, PDFs as a download with a safe name. */
  disposition: string;
}

/** A download name safe in a quoted header: ASCII letters, digits, dot, dash, underscore and space. */
function safeFileName(name: string, extension: string): string {
  const cleaned = name.replace(/[^\w .-]/g, '_').replace(/^[.\s]+/, '').slice(0, 100).trim();
  return cleaned.toLowerCase().endsWith(`.${extension}`) ? cleaned : `${cleaned || 'file'}.${extension}`;
}

export function createUploadsService(repo: UploadsRepo, storage: FileStorage) {
  return {
    async get(id: string): Promise<ServedUpload> {
      const row = await repo.findById(id);
      if (!row) throw new AppError(404, 'upload_not_found', 'No such file.');
      const disposition = row.kind === 'photo' ? 'inline' : `attachment; filename="${safeFileName(row.originalName, 'pdf')}"`;
      return { path: storage.pathOf(row.storageKey), contentType: row.contentType, disposition };
    },
  };
}

export type UploadsService = ReturnType<typeof createUploadsService>;
