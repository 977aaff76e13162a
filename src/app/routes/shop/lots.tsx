import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { getLotsQueryOptions } from '@/features/lots/api/get-lots';
import { LotFiltersForm } from '@/features/lots/components/lot-filters-form';
import { LotList } from '@/features/lots/components/lot-list';
import { useLotFilters } from '@/features/lots/hooks/use-lot-filters';
import { useLotOrigins } from '@/features/lots/hooks/use-lot-origins';
import { parseLotFilters } from '@/features/lots/utils/lot-filters';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(getLotsQueryOptions(parseLotFilters(new URL(request.url).searchParams)));
    return null;
  };

export default function LotsRoute() {
  const { filters, updateFilters, priceUnit, setPriceUnit } = useLotFilters();
  const origins = useLotOrigins();

  return (
    <>
      <PageTitle title="Green Lots" />
      <PageHeader
        eyebrow="For home roasters"
        title="Green Lots"
        lead="Unroasted coffee, sold by weight. Each lot lists what a roaster looks for first, and the roast level we suggest."
      />
      <div className="grid gap-6">
        <LotFiltersForm filters={filters} origins={origins} onChange={updateFilters} priceUnit={priceUnit} onPriceUnitChange={setPriceUnit} />
        <LotList filters={filters} priceUnit={priceUnit} />
      </div>
    </>
  );
}
