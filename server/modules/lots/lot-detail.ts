import type { LotDetail } from '@shared/schemas/lots';
import type { lots } from '../../db/schema/index';
import type { UploadKind } from '../../db/schema/enums';

/** Where `GET /api/uploads/:id` serves an uploaded file. */
export const uploadUrl = (id: string) => `/api/uploads/${id}`;

/** A lot row, its price breaks and its files (in display order) in the contract's detail shape. */
export function lotDetailOf(lot: typeof lots.$inferSelect, priceBreaks: LotDetail['priceBreaks'], files: { id: string; kind: UploadKind }[]): LotDetail {
  const specSheet = files.find((file) => file.kind === 'spec_sheet');
  return {
    code: lot.code,
    name: lot.name,
    origin: lot.origin,
    region: lot.region,
    producer: lot.producer,
    variety: lot.variety,
    process: lot.process,
    altitudeM: lot.altitudeM,
    cropYear: lot.cropYear,
    moisturePct: lot.moisturePct,
    densityGPerL: lot.densityGPerL,
    screenSize: lot.screenSize,
    cuppingScore: lot.cuppingScore,
    tastingNotes: lot.tastingNotes,
    description: lot.description,
    suggestedLevel: lot.suggestedLevel,
    allowedLevels: lot.allowedLevels,
    stockGrams: lot.stockGrams,
    pricePerKgCents: lot.pricePerKgCents,
    priceBreaks,
    photos: files.filter((file) => file.kind === 'photo').map((file) => uploadUrl(file.id)),
    specSheetUrl: specSheet ? uploadUrl(specSheet.id) : null,
  };
}
