import type { QueryClient } from '@tanstack/react-query';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { getLotsQueryOptions, useLots } from '@/features/lots/api/get-lots';
import { getSubscribersQueryOptions } from '@/features/subscribers/api/get-subscribers';
import { SubscriberFiltersForm } from '@/features/subscribers/components/subscriber-filters-form';
import { SubscribersTable } from '@/features/subscribers/components/subscribers-table';
import { parseSubscriberFilters, subscriberFiltersToSearch, type SubscriberFilters } from '@/features/subscribers/utils/subscriber-filters';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(getSubscribersQueryOptions(parseSubscriberFilters(new URL(request.url).searchParams)));
    void queryClient.prefetchQuery(getLotsQueryOptions());
    return null;
  };

export default function SubscribersRoute() {
  const [search, setSearch] = useSearchParams();
  const filters = parseSubscriberFilters(search);
  const lots = useLots().data?.items ?? [];
  const update = (change: Partial<SubscriberFilters>) => setSearch(subscriberFiltersToSearch({ ...filters, ...change }), { replace: true });

  return (
    <>
      <PageTitle title="Subscribers · Roastery" />
      <PageHeader
        eyebrow="Roastery"
        title="Subscribers"
        lead="Every Roasted to Order subscription: what it brings, how often and when it next roasts. Open one for its deliveries."
      />
      <div className="grid gap-6">
        <SubscriberFiltersForm filters={filters} lots={lots} onChange={update} />
        <SubscribersTable filters={filters} onPageChange={(page) => setSearch(subscriberFiltersToSearch({ ...filters, page }))} />
      </div>
    </>
  );
}
