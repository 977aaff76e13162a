import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { isStorableText, unstorableTextMessage } from '@shared/schemas/text';
import { z } from 'zod';
import type { GreenStockResponse } from '@shared/schemas/green-stock';
import {
  lotCreateSchema,
  lotUpdateSchema,
  stockAdjustmentSchema,
  type LotFile,
  type LotStaffDetail,
  type StockAdjustmentResponse,
  type StockMovementListResponse,
} from '@shared/schemas/lots';
import { AppError } from '../../lib/app-error';
import { requireRole } from '../../middleware/require-role';
import type { LotsAdminService, UploadedFile } from './lots-admin.service';

const lotCodeParams = z.object({ code: z.string().trim().min(1).max(40) });
const photoParams = lotCodeParams.extend({ id: z.uuid() });

const MB = 1024 * 1024;
const staffOnly = requireRole('staff', 'owner');

/**
 * Reads one file from the multipart field `file` into memory, at most `maxBytes`: a larger file is
 * a 413. The content type is checked later, from the bytes.
 */
function singleFile(maxBytes: number, described: string): RequestHandler {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 0, parts: 1 } }).single('file');
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError(413, 'file_too_large', `The file is larger than ${maxBytes / MB} MB.`, { file: `must be ${maxBytes / MB} MB or less` }));
        }
        return next(new AppError(400, 'invalid_upload', `Send ${described} as the one multipart field "file".`, { file: error.message }));
      }
      // Anything else the multipart parser throws (no or wrong boundary, a broken part header, a cut-off body) is the request's fault.
      if (error)
        return next(
          new AppError(400, 'invalid_upload', `Send ${described} as a multipart/form-data body with the field "file".`, { file: 'could not be read' }),
        );
      next();
    });
  };
}

/** The file multer read; a request without one is a 400. */
function uploadedFile(file: Express.Multer.File | undefined): UploadedFile {
  if (!file) throw new AppError(400, 'file_required', 'Send the file as the multipart field "file".', { file: 'is required' });
  if (!isStorableText(file.originalname)) throw AppError.badRequest('The file name has characters Restday cannot store.', { file: unstorableTextMessage });
  return { buffer: file.buffer, originalname: file.originalname, size: file.size };
}

/** Staff's writes to lots under `/api/lots`: descriptors, photos, spec sheet and stock. */
export function lotsAdminRoutes(service: LotsAdminService): Router {
  const router = Router();

  router.post('/', staffOnly, async (req, res) => {
    const lot = await service.create(lotCreateSchema.parse(req.body));
    res.status(201).json(lot satisfies LotStaffDetail);
  });

  router.patch('/:code', staffOnly, async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.json((await service.update(code, lotUpdateSchema.parse(req.body))) satisfies LotStaffDetail);
  });

  router.post('/:code/photos', staffOnly, singleFile(5 * MB, 'a JPEG, PNG or WebP image'), async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    const file = await service.addPhoto(code, uploadedFile(req.file), req.user!.id);
    res.status(201).json(file satisfies LotFile);
  });

  router.delete('/:code/photos/:id', staffOnly, async (req, res) => {
    const { code, id } = photoParams.parse(req.params);
    await service.deletePhoto(code, id);
    res.status(204).end();
  });

  router.post('/:code/spec-sheet', staffOnly, singleFile(10 * MB, 'a PDF'), async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    const file = await service.replaceSpecSheet(code, uploadedFile(req.file), req.user!.id);
    res.status(201).json(file satisfies LotFile);
  });

  router.post('/:code/stock-adjustments', staffOnly, async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    const result = await service.adjustStock(code, stockAdjustmentSchema.parse(req.body), req.user!.id);
    res.json(result satisfies StockAdjustmentResponse);
  });

  router.get('/:code/stock-movements', staffOnly, async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.setHeader('Cache-Control', 'no-store');
    res.json((await service.movements(code)) satisfies StockMovementListResponse);
  });

  return router;
}

/** `GET /api/roastery/green-stock`: every lot's grams on hand, reorder alert and days of cover; `/:code`: one lot whole. */
export function greenStockRoutes(service: LotsAdminService): Router {
  const router = Router();
  router.get('/', staffOnly, async (_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json((await service.greenStock()) satisfies GreenStockResponse);
  });
  // The staff's read of one lot, listed or not (the public lot page shows listed lots only).
  router.get('/:code', staffOnly, async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.setHeader('Cache-Control', 'no-store');
    res.json((await service.detail(code)) satisfies LotStaffDetail);
  });
  return router;
}
