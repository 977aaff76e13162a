import type { LotSummary } from '@shared/schemas/lots';
import type { PriceUnit } from '../utils/price-per-unit';
import { LotCard } from './lot-card';
import { LotCardSkeleton } from './lot-card-skeleton';

const gridStyles = 'grid grid-cols-1 gap-5 sm:grid-cols-2 lg:grid-cols-3';

export function LotGrid({ lots, headingLevel, priceUnit }: { lots: LotSummary[]; headingLevel?: 'h2' | 'h3'; priceUnit?: PriceUnit }) {
  return (
    <ul className={gridStyles}>
      {lots.map((lot) => (
        <li key={lot.code}>
          <LotCard lot={lot} headingLevel={headingLevel} priceUnit={priceUnit} />
        </li>
      ))}
    </ul>
  );
}

export function LotGridSkeleton({ count, label }: { count: number; label: string }) {
  return (
    <div>
      <p role="status" className="sr-only">
        {label}
      </p>
      <div className={gridStyles}>
        {Array.from({ length: count }, (_, index) => (
          <LotCardSkeleton key={index} />
        ))}
      </div>
    </div>
  );
}
