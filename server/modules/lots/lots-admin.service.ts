import { averageDailyUseGrams, coverWindowDays, daysOfCover, isAtReorderPoint } from '@shared/domain/stock-cover';
import type { GreenStockResponse } from '@shared/schemas/green-stock';
import {
  lotConsistencyProblems,
  type LotCreate,
  type LotFile,
  type LotStaffDetail,
  type LotUpdate,
  type StockAdjustment,
  type StockAdjustmentResponse,
  type StockMovementListResponse,
} from '@shared/schemas/lots';
import type { FileStorage } from '../../integrations/storage';
import type { UploadKind } from '../../db/schema/enums';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import { detectFileType, fileSignatures, type FileType } from '../uploads';
import { lotDetailOf, uploadUrl } from './lot-detail';
import type { LotsAdminRepo, NewUpload } from './lots-admin.repo';

const DAY_MS = 24 * 60 * 60 * 1000;
/** The stock history shows this many movements, newest first. */
const movementHistoryLength = 500;

/** What each kind of upload may be, by content. */
const acceptedTypes: Record<UploadKind, { types: readonly FileType[]; described: string }> = {
  photo: { types: ['jpeg', 'png', 'webp'], described: 'a JPEG, PNG or WebP image' },
  spec_sheet: { types: ['pdf'], described: 'a PDF' },
};

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
  size: number;
}

const lotNotFound = (code: string) => new AppError(404, 'lot_not_found', `No lot with code ${code}.`);

/** The client's file name, kept for display and download names only: printable, short, no path. */
function displayName(originalName: string, extension: string): string {
  const base = (originalName.split(/[\\/]/).pop() ?? '')
    .replace(/[^\w .()-]/g, '')
    .trim()
    .slice(0, 100);
  return base || `file.${extension}`;
}

/** Each lot's last day to reorder and whether that day has come (green planning); none without planning. */
export type ReorderDates = () => Promise<ReadonlyMap<string, { reorderBy: string | null; reorderNow: boolean }>>;

export function createLotsAdminService(repo: LotsAdminRepo, storage: FileStorage, clock: Clock, reorderDates: ReorderDates = async () => new Map()) {
  async function detail(code: string): Promise<LotStaffDetail> {
    const found = await repo.findByCode(code);
    if (!found) throw lotNotFound(code);
    return {
      ...lotDetailOf(found.lot, found.priceBreaks, found.files),
      reorderPointGrams: found.lot.reorderPointGrams,
      supplierLeadTimeDays: found.lot.supplierLeadTimeDays,
      isListed: found.lot.isListed,
    };
  }

  async function requireLotId(code: string) {
    const lotId = await repo.lotIdOf(code);
    if (!lotId) throw lotNotFound(code);
    return lotId;
  }

  /** Checks the bytes are what `kind` accepts, stores them, and records them with `record`; the file is removed if recording fails. */
  async function storeUpload<T>(kind: UploadKind, file: UploadedFile, record: (upload: NewUpload) => Promise<T>): Promise<{ result: T; upload: NewUpload }> {
    const type = detectFileType(file.buffer);
    const accepted = acceptedTypes[kind];
    if (!type || !accepted.types.includes(type)) {
      throw new AppError(415, 'unsupported_file_type', `The file must be ${accepted.described}; its content is not.`, {
        file: `must be ${accepted.described}`,
      });
    }
    const { contentType, extension } = fileSignatures[type];
    const storageKey = await storage.save(file.buffer, extension);
    const upload: NewUpload = { kind, storageKey, contentType, byteSize: file.size, originalName: displayName(file.originalname, extension) };
    try {
      return { result: await record(upload), upload };
    } catch (error) {
      await storage.remove(storageKey);
      throw error;
    }
  }

  const lotFile = (id: string, upload: NewUpload): LotFile => ({
    id,
    kind: upload.kind,
    url: uploadUrl(id),
    contentType: upload.contentType,
    byteSize: upload.byteSize,
  });

  return {
    detail,

    async create(input: LotCreate): Promise<LotStaffDetail> {
      const { priceBreaks, ...columns } = input;
      const lotId = await repo.create(columns, priceBreaks);
      if (!lotId) throw new AppError(409, 'lot_code_taken', `A lot with code ${input.code} already exists.`, { code: 'is already used by another lot' });
      return detail(input.code);
    },

    async update(code: string, patch: LotUpdate): Promise<LotStaffDetail> {
      const found = await repo.findByCode(code);
      if (!found) throw lotNotFound(code);
      const { priceBreaks, ...columns } = patch;
      // The patch was checked on its own; the lot it leaves behind must hold together too.
      const problems = lotConsistencyProblems({
        suggestedLevel: columns.suggestedLevel ?? found.lot.suggestedLevel,
        allowedLevels: columns.allowedLevels ?? found.lot.allowedLevels,
        pricePerKgCents: columns.pricePerKgCents ?? found.lot.pricePerKgCents,
        priceBreaks: priceBreaks ?? found.priceBreaks,
      });
      if (Object.keys(problems).length > 0) throw AppError.badRequest('Some fields are not valid.', problems);
      await repo.update(found.lot.id, columns, priceBreaks);
      return detail(code);
    },

    async addPhoto(code: string, file: UploadedFile, actorId: string): Promise<LotFile> {
      const lotId = await requireLotId(code);
      const { result: id, upload } = await storeUpload('photo', file, (made) => repo.addPhoto(lotId, made, actorId));
      return lotFile(id, upload);
    },

    async replaceSpecSheet(code: string, file: UploadedFile, actorId: string): Promise<LotFile> {
      const lotId = await requireLotId(code);
      const { result, upload } = await storeUpload('spec_sheet', file, (made) => repo.replaceSpecSheet(lotId, made, actorId));
      for (const key of result.replacedKeys) await storage.remove(key);
      return lotFile(result.id, upload);
    },

    async deletePhoto(code: string, uploadId: string): Promise<void> {
      const lotId = await requireLotId(code);
      const storageKey = await repo.deletePhoto(lotId, uploadId);
      if (!storageKey) throw new AppError(404, 'photo_not_found', `Lot ${code} has no such photo.`);
      await storage.remove(storageKey);
    },

    async adjustStock(code: string, adjustment: StockAdjustment, actorId: string): Promise<StockAdjustmentResponse> {
      const result = await repo.adjustStock(code, adjustment, actorId);
      if (result === 'no_lot') throw lotNotFound(code);
      if (result === 'below_zero') {
        throw new AppError(409, 'stock_below_zero', `Lot ${code} does not hold that many grams; stock cannot go below zero.`, {
          deltaGrams: 'would take stock below zero',
        });
      }
      return result;
    },

    async movements(code: string): Promise<StockMovementListResponse> {
      const lotId = await requireLotId(code);
      const rows = await repo.movements(lotId, movementHistoryLength);
      return { items: rows.map((row) => ({ ...row, createdAt: row.createdAt.toISOString() })) };
    },

    async greenStock(): Promise<GreenStockResponse> {
      const [rows, reorder] = await Promise.all([repo.greenStock(new Date(clock.now().getTime() - coverWindowDays * DAY_MS)), reorderDates()]);
      return {
        windowDays: coverWindowDays,
        items: rows.map(({ usedGrams, ...row }) => ({
          ...row,
          reorderBy: reorder.get(row.code)?.reorderBy ?? null,
          reorderAlert: isAtReorderPoint(row.stockGrams, row.reorderPointGrams) || (reorder.get(row.code)?.reorderNow ?? false),
          usedGramsInWindow: usedGrams,
          averageDailyUseGrams: averageDailyUseGrams(usedGrams),
          daysOfCover: daysOfCover(row.stockGrams, usedGrams),
        })),
      };
    },
  };
}

export type LotsAdminService = ReturnType<typeof createLotsAdminService>;
