import path from 'node:path';
import { Router } from 'express';
import { z } from 'zod';
import { AppError } from '../../lib/app-error';
import type { UploadsService } from './uploads.service';

// A bad id is simply unknown: same 404 as a missing row.
const uploadParams = z.object({ id: z.uuid() });
const YEAR_SECONDS = 365 * 24 * 60 * 60;

/**
 * `GET /api/uploads/:id` (public): a lot's photo or spec sheet, with the type recorded at upload
 * (never guessed from a name), nosniff, and a year's cache (a file never changes under its id).
 */
export function uploadsRoutes(service: UploadsService): Router {
  const router = Router();
  router.get('/:id', async (req, res, next) => {
    const params = uploadParams.safeParse(req.params);
    if (!params.success) throw new AppError(404, 'upload_not_found', 'No such file.');
    const file = await service.get(params.data.id);
    if (file.downloadName) res.attachment(file.downloadName);
    else res.setHeader('Content-Disposition', 'inline');
    // The type recorded at upload, never one guessed from the download name.
    res.setHeader('Content-Type', file.contentType);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    // A file never changes under its id, so this one answer may be kept (the API's default is no-store).
    res.removeHeader('Cache-Control');
    // Only the file's own name is checked for a leading dot: the uploads folder itself may be one (.data/uploads).
    res.sendFile(path.basename(file.path), { root: path.dirname(file.path), maxAge: YEAR_SECONDS * 1000, immutable: true, dotfiles: 'deny' }, (error) => {
      if (!error) return;
      for (const header of ['Content-Type', 'Content-Disposition', 'Cache-Control']) res.removeHeader(header);
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return next(new AppError(404, 'upload_not_found', 'No such file.'));
      next(error);
    });
  });
  return router;
}
