import type { QueryClient } from '@tanstack/react-query';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { requireUser } from '@/features/auth/utils/require-user';
import { getOrdersQueryOptions } from '@/features/orders/api/get-orders';
import { OrderList } from '@/features/orders/components/order-list';

function pageOf(search: URLSearchParams): number {
  const page = Number(search.get('page'));
  return Number.isInteger(page) && page >= 1 ? page : 1;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getOrdersQueryOptions(pageOf(new URL(request.url).searchParams)));
    return null;
  };

export default function AccountOrdersRoute() {
  const [search, setSearch] = useSearchParams();
  const page = pageOf(search);
  return (
    <>
      <PageTitle title="Orders" />
      <PageHeader title="Orders" lead="Everything you have ordered, newest first. Open one to see its bags, dates and tracking." />
      <OrderList page={page} onPageChange={(next) => setSearch(next === 1 ? {} : { page: String(next) })} />
    </>
  );
}
