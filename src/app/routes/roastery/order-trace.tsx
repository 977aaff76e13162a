import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { getOrderTraceQueryOptions } from '@/features/trace/api/get-order-trace';
import { OrderTrace } from '@/features/trace/components/order-trace';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.id) void queryClient.prefetchQuery(getOrderTraceQueryOptions(params.id));
    return null;
  };

export default function OrderTraceRoute() {
  const { id = '' } = useParams();
  return (
    <>
      <PageTitle title="Order trace · Roastery" />
      <PageHeader eyebrow="Roastery · Trace" title="Order trace" lead="The batches and lots this order’s bags came from, for a recall." />
      <OrderTrace orderId={id} />
    </>
  );
}
