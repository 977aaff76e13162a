import { MapPin } from 'lucide-react';
import { Link } from 'react-router-dom';
import { processLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { LotSummary } from '@shared/schemas/lots';
import { paths } from '@/config/paths';
import { formatAltitude } from '@/lib/format';
import { useLotPrice } from '../hooks/use-lot-price';
import type { PriceUnit } from '../utils/price-per-unit';
import { LotPhoto } from './lot-photo';
import { StockBadge } from './stock-badge';

export function LotCard({ lot, headingLevel = 'h2', priceUnit = 'kg' }: { lot: LotSummary; headingLevel?: 'h2' | 'h3'; priceUnit?: PriceUnit }) {
  const price = useLotPrice(priceUnit);
  const Heading = headingLevel;
  const outOfStock = lot.stockGrams <= 0;

  return (
    <article
      data-testid="lot-card"
      className="relative flex h-full flex-col overflow-hidden rounded-card border border-rule bg-sheet shadow-card transition-shadow focus-within:ring-3 focus-within:ring-focus hover:border-rule-strong"
    >
      <LotPhoto src={lot.photoUrl} alt="" origin={lot.origin} dimmed={outOfStock} />
      <div className="flex flex-1 flex-col gap-3 p-4">
        <div>
          <p className="flex items-center gap-1 text-small text-ink-muted">
            <MapPin aria-hidden="true" className="size-4 shrink-0" />
            <span>
              {lot.origin} · {lot.region}
            </span>
          </p>
          <Heading className="mt-1 text-h3">
            <Link to={paths.lot.getHref(lot.code, priceUnit)} className="text-ink no-underline outline-none after:absolute after:inset-0 hover:underline">
              {lot.name}
            </Link>
          </Heading>
        </div>

        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-small">
          <div>
            <dt className="text-ink-muted">Process</dt>
            <dd className="font-semibold">{processLabels[lot.process]}</dd>
          </div>
          <div>
            <dt className="text-ink-muted">Variety</dt>
            <dd className="font-semibold">{lot.variety}</dd>
          </div>
          <div>
            <dt className="text-ink-muted">Altitude</dt>
            <dd className="font-semibold">{formatAltitude(lot.altitudeM)}</dd>
          </div>
          <div>
            <dt className="text-ink-muted">Suggested roast</dt>
            <dd className="font-semibold">{roastLevelLabels[lot.suggestedLevel]}</dd>
          </div>
        </dl>

        {lot.tastingNotes.length > 0 ? (
          <ul aria-label="Tasting notes" className="flex flex-wrap gap-1.5">
            {lot.tastingNotes.map((note) => (
              <li key={note} className="rounded-pill border border-rule px-2.5 py-0.5 text-caption">
                {note}
              </li>
            ))}
          </ul>
        ) : null}

        <div className="mt-auto flex flex-wrap items-center justify-between gap-2 border-t border-rule pt-3">
          <p className="font-semibold">{price(lot.pricePerKgCents)}</p>
          <StockBadge stockGrams={lot.stockGrams} />
        </div>
      </div>
    </article>
  );
}
