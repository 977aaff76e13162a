import type { ReactNode } from 'react';
import { processLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { LotDetail } from '@shared/schemas/lots';
import { DownloadLink } from '@/components/ui/download-link';
import { formatAltitude, formatPercent, formatScore } from '@/lib/format';
import { useLotPrice } from '../hooks/use-lot-price';
import type { PriceUnit } from '../utils/price-per-unit';
import { formatBulkWeight, type WeightUnit } from '../utils/weight-unit';
import { LotPhoto } from './lot-photo';
import { StockBadge } from './stock-badge';

function Descriptor({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="border-b border-rule py-2.5">
      <dt className="text-small text-ink-muted">{term}</dt>
      <dd className="font-semibold">{children}</dd>
    </div>
  );
}

/** Everything Restday knows about one green lot, as a home roaster reads it; `purchase` sits under the price. */
export function LotDetails({
  lot,
  purchase,
  priceUnit = 'kg',
  weightUnit = 'g',
}: {
  lot: LotDetail;
  purchase?: ReactNode;
  priceUnit?: PriceUnit;
  weightUnit?: WeightUnit;
}) {
  const price = useLotPrice(priceUnit);
  const outOfStock = lot.stockGrams <= 0;
  const [firstPhoto = null, ...morePhotos] = lot.photos;

  return (
    <article>
      <div className="grid gap-8 lg:grid-cols-2">
        <div className="flex flex-col gap-3">
          <div className="overflow-hidden rounded-card border border-rule">
            <LotPhoto src={firstPhoto} alt={firstPhoto ? `${lot.name}, photo 1` : ''} origin={lot.origin} dimmed={outOfStock} />
          </div>
          {morePhotos.length > 0 ? (
            <ul className="grid grid-cols-3 gap-3">
              {morePhotos.map((photo, index) => (
                <li key={photo} className="overflow-hidden rounded-control border border-rule">
                  <LotPhoto src={photo} alt={`${lot.name}, photo ${index + 2}`} origin={lot.origin} />
                </li>
              ))}
            </ul>
          ) : null}
        </div>

        <div>
          <p className="text-small font-semibold tracking-wide text-ember uppercase">
            {lot.origin} · {lot.region}
          </p>
          <h1 className="mt-1 text-h1">{lot.name}</h1>
          <p className="mt-1 text-small text-ink-muted">Lot code {lot.code}</p>

          <div className="mt-5 flex flex-wrap items-center gap-3">
            <p className="text-h2 font-heading font-semibold">{price(lot.pricePerKgCents)}</p>
            <StockBadge stockGrams={lot.stockGrams} />
          </div>
          {lot.priceBreaks.length > 0 ? (
            <ul aria-label="Quantity prices" className="mt-2 text-small text-ink-muted">
              {lot.priceBreaks.map((priceBreak) => (
                <li key={priceBreak.minGrams}>
                  {formatBulkWeight(priceBreak.minGrams, weightUnit)} or more: {price(priceBreak.pricePerKgCents)}
                </li>
              ))}
            </ul>
          ) : null}

          {purchase ? <div className="mt-5">{purchase}</div> : null}

          {lot.tastingNotes.length > 0 ? (
            <ul aria-label="Tasting notes" className="mt-5 flex flex-wrap gap-2">
              {lot.tastingNotes.map((note) => (
                <li key={note} className="rounded-pill bg-leaf-wash px-3 py-1 text-small font-semibold text-leaf-deep">
                  {note}
                </li>
              ))}
            </ul>
          ) : null}

          {lot.description ? <p className="mt-5 max-w-prose">{lot.description}</p> : null}

          {lot.specSheetUrl ? (
            <DownloadLink href={lot.specSheetUrl} className="mt-5 inline-flex min-h-11 items-center gap-2 font-semibold text-leaf underline">
              Download the spec sheet
            </DownloadLink>
          ) : null}
        </div>
      </div>

      <section aria-labelledby="descriptors" className="mt-10">
        <h2 id="descriptors" className="text-h2">
          Green coffee descriptors
        </h2>
        <dl className="mt-3 grid grid-cols-1 gap-x-8 sm:grid-cols-2 lg:grid-cols-3">
          <Descriptor term="Origin">{lot.origin}</Descriptor>
          <Descriptor term="Region">{lot.region}</Descriptor>
          <Descriptor term="Producer">{lot.producer}</Descriptor>
          <Descriptor term="Variety">{lot.variety}</Descriptor>
          <Descriptor term="Process">{processLabels[lot.process]}</Descriptor>
          <Descriptor term="Altitude">{formatAltitude(lot.altitudeM)}</Descriptor>
          <Descriptor term="Crop year">{lot.cropYear}</Descriptor>
          <Descriptor term="Moisture">{formatPercent(lot.moisturePct)}</Descriptor>
          {lot.densityGPerL !== null ? <Descriptor term="Density">{lot.densityGPerL} g/L</Descriptor> : null}
          {lot.screenSize !== null ? <Descriptor term="Screen size">{lot.screenSize}</Descriptor> : null}
          {lot.cuppingScore !== null ? <Descriptor term="Cupping score">{formatScore(lot.cuppingScore)}</Descriptor> : null}
          <Descriptor term="Suggested roast level">{roastLevelLabels[lot.suggestedLevel]}</Descriptor>
          <Descriptor term="Roast levels that suit it">{lot.allowedLevels.map((level) => roastLevelLabels[level]).join(', ')}</Descriptor>
        </dl>
      </section>
    </article>
  );
}
