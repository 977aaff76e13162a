import type { QueryClient } from '@tanstack/react-query';
import { ArrowLeft } from 'lucide-react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { getSubscriberQueryOptions, useSubscriber } from '@/features/subscribers/api/get-subscriber';
import { ActForSubscriber } from '@/features/subscribers/components/act-for-subscriber';
import { SubscriberDetailView } from '@/features/subscribers/components/subscriber-detail-view';
import { ApiError } from '@/lib/api-client';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.id) void queryClient.prefetchQuery(getSubscriberQueryOptions(params.id));
    return null;
  };

export default function SubscriberRoute() {
  const { id = '' } = useParams();
  const subscriberQuery = useSubscriber(id);
  const backLink = (
    <Link to={paths.roastery.subscribers.getHref()} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-semibold text-leaf underline">
      <ArrowLeft aria-hidden="true" className="size-4" />
      All subscribers
    </Link>
  );

  if (subscriberQuery.data) {
    const subscriber = subscriberQuery.data;
    return (
      <>
        <PageTitle title={`${subscriber.customer.name} · Subscribers`} />
        {backLink}
        <PageHeader eyebrow="Subscriber" title={subscriber.customer.name} />
        <SubscriberDetailView subscriber={subscriber} />
        <div className="mt-8 max-w-2xl">
          <ActForSubscriber key={subscriber.id} subscriber={subscriber} />
        </div>
      </>
    );
  }
  if (subscriberQuery.isError) {
    if (subscriberQuery.error instanceof ApiError && subscriberQuery.error.status === 404) {
      return (
        <>
          <PageTitle title="Subscriber not found" />
          <NotFoundMessage title="Subscriber not found">No subscription has this address.</NotFoundMessage>
        </>
      );
    }
    return (
      <>
        <PageTitle title="Subscribers" />
        {backLink}
        <ErrorState title="This subscriber could not load" error={subscriberQuery.error} onRetry={() => void subscriberQuery.refetch()} />
      </>
    );
  }
  return (
    <>
      <PageTitle title="Subscribers" />
      {backLink}
      <p role="status" className="sr-only">
        Loading the subscriber…
      </p>
      <Skeleton className="h-72 rounded-card" />
    </>
  );
}
