import type { QueryClient } from '@tanstack/react-query';
import { ArrowLeft } from 'lucide-react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { HomeRoastingCautions } from '@/components/safety/home-roasting-cautions';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useLot, getLotQueryOptions } from '@/features/lots/api/get-lot';
import { LotDetails } from '@/features/lots/components/lot-details';
import { ApiError } from '@/lib/api-client';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.code) void queryClient.prefetchQuery(getLotQueryOptions(params.code));
    return null;
  };

function LotPageSkeleton() {
  return (
    <div className="grid gap-8 lg:grid-cols-2">
      <p role="status" className="sr-only">
        Loading the lot…
      </p>
      <Skeleton className="aspect-[4/3] rounded-card" />
      <div className="flex flex-col gap-3">
        <Skeleton className="h-4 w-1/3" />
        <Skeleton className="h-10 w-3/4" />
        <Skeleton className="h-8 w-1/2" />
        <Skeleton className="h-24" />
      </div>
    </div>
  );
}

export default function LotRoute() {
  const { code = '' } = useParams();
  const lotQuery = useLot(code);

  const backLink = (
    <Link to={paths.lots.getHref()} className="mb-6 inline-flex min-h-11 items-center gap-1.5 font-semibold text-leaf underline">
      <ArrowLeft aria-hidden="true" className="size-4" />
      All Green Lots
    </Link>
  );

  if (lotQuery.data) {
    return (
      <>
        <PageTitle title={`${lotQuery.data.name} · Green Lots`} />
        {backLink}
        <LotDetails lot={lotQuery.data} />
        <div className="mt-10 max-w-prose">
          <HomeRoastingCautions />
          <p className="mt-3">
            <Link to={paths.roastingBasics.getHref()} className="font-semibold text-leaf underline">
              How a roast goes, step by step
            </Link>
          </p>
        </div>
      </>
    );
  }

  if (lotQuery.isError) {
    if (lotQuery.error instanceof ApiError && lotQuery.error.status === 404) {
      return (
        <>
          <PageTitle title="Lot not found" />
          <NotFoundMessage title="Lot not found">
            No green lot has the code {code}. It may have sold out and been taken off the list.
          </NotFoundMessage>
        </>
      );
    }
    return (
      <>
        <PageTitle title="Green Lots" />
        {backLink}
        <ErrorState title="This lot could not load" error={lotQuery.error} onRetry={() => void lotQuery.refetch()} />
      </>
    );
  }

  return (
    <>
      <PageTitle title="Green Lots" />
      {backLink}
      <LotPageSkeleton />
    </>
  );
}
