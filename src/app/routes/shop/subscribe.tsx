import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { getLotQueryOptions } from '@/features/lots/api/get-lot';
import { getLotsQueryOptions, useLots } from '@/features/lots/api/get-lots';
import { SubscriptionBuilder } from '@/features/subscriptions/components/subscription-builder';
import { rotationSearchValue } from '@/features/subscriptions/utils/builder-search';

function chosenLotCode(search: URLSearchParams): string | null {
  const code = search.get('lot')?.trim();
  return code && code !== rotationSearchValue ? code : null;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(getLotsQueryOptions());
    const code = chosenLotCode(new URL(request.url).searchParams);
    if (code) void queryClient.prefetchQuery(getLotQueryOptions(code));
    return null;
  };

function Builder() {
  const [search] = useSearchParams();
  const signedIn = Boolean(useCurrentUser().data);
  const lotsQuery = useLots();
  const code = chosenLotCode(search);
  const lotQuery = useQuery({ ...getLotQueryOptions(code ?? ''), enabled: code !== null });

  if (lotsQuery.isError) {
    return <ErrorState title="The coffees could not load" error={lotsQuery.error} onRetry={() => void lotsQuery.refetch()} />;
  }
  if (!lotsQuery.data) {
    return (
      <>
        <p role="status" className="sr-only">
          Loading the coffees…
        </p>
        <Skeleton className="h-96 rounded-card" />
      </>
    );
  }
  const lots = lotsQuery.data.items.filter((lot) => lot.stockGrams > 0 || lot.code === code);
  return <SubscriptionBuilder lots={lots} chosenLot={lotQuery.data} signedIn={signedIn} />;
}

export default function SubscribeRoute() {
  const [search] = useSearchParams();
  const [cameBackUnpaid] = useState(() => search.get('checkout') === 'cancelled');
  return (
    <>
      <PageTitle title="Roasted to Order" />
      <PageHeader
        eyebrow="Subscription"
        title="Roasted to Order"
        lead="Coffee roasted for you on a roast day, rested, and shipped so it reaches you ready to brew. Skip, pause, change or cancel whenever you like."
      />
      {cameBackUnpaid ? (
        <div className="mb-6">
          <FormAlert>The payment was not completed, so nothing was charged and no subscription started. Your choices are below.</FormAlert>
        </div>
      ) : null}
      <Builder />

      <section aria-labelledby="why-rest" className="mt-12 max-w-prose">
        <h2 id="why-rest" className="text-h2">
          Why the rest?
        </h2>
        <p className="mt-3">
          Freshly roasted coffee is still giving off carbon dioxide, and brewed too soon it tastes sharp and uneven. Each bag carries its roast date and a
          ready-from date; espresso needs a longer rest than filter, so your brew method sets the date. Each bag also shows a best-before date, the end of its
          best window.
        </p>
      </section>
    </>
  );
}
