import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles } from '@/features/auth/utils/roles';
import { getRoasteryOrdersQueryOptions } from '@/features/roastery-orders/api/get-roastery-orders';
import { OrderFiltersForm } from '@/features/roastery-orders/components/order-filters-form';
import { RoasteryOrderList } from '@/features/roastery-orders/components/roastery-order-list';
import { useRoasteryOrderFilters } from '@/features/roastery-orders/hooks/use-roastery-order-filters';
import { parseRoasteryOrderFilters, roasteryOrderFilterProblems } from '@/features/roastery-orders/utils/order-filters';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Only the team's browsers ask for everyone's orders; anyone else is shown why the page is closed.
    const user = await requireUser(queryClient, request);
    const filters = parseRoasteryOrderFilters(new URL(request.url).searchParams);
    if (roasteryRoles.includes(user.role) && Object.keys(roasteryOrderFilterProblems(filters)).length === 0) {
      void queryClient.prefetchQuery(getRoasteryOrdersQueryOptions(filters));
    }
    return null;
  };

export default function RoasteryOrdersRoute() {
  const { filters, updateFilters } = useRoasteryOrderFilters();
  return (
    <>
      <PageTitle title="Orders · Roastery" />
      <PageHeader
        eyebrow="Roastery"
        title="Orders"
        lead="Every customer’s orders, green and roasted. Filter, sort, open one, or take the list away as a spreadsheet."
      />
      <div className="grid gap-6">
        <OrderFiltersForm filters={filters} onChange={updateFilters} />
        <RoasteryOrderList filters={filters} />
      </div>
    </>
  );
}
