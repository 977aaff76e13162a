import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { getBatchTraceQueryOptions, useBatchTrace } from '@/features/trace/api/get-batch-trace';
import { BatchTraceView } from '@/features/trace/components/batch-trace-view';
import { ApiError } from '@/lib/api-client';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.id) void queryClient.prefetchQuery(getBatchTraceQueryOptions(params.id));
    return null;
  };

export default function BatchTraceRoute() {
  const { id = '' } = useParams();
  const trace = useBatchTrace(id);

  if (trace.isError) {
    if (trace.error instanceof ApiError && (trace.error.status === 404 || trace.error.status === 400)) {
      return <NotFoundMessage title="No such batch">There is no batch at this address. It may have been mistyped.</NotFoundMessage>;
    }
    return <ErrorState title="The batch could not load" error={trace.error} onRetry={() => void trace.refetch()} />;
  }
  if (!trace.data) {
    return (
      <div>
        <p role="status" className="sr-only">
          Loading the batch…
        </p>
        <Skeleton className="h-64 rounded-card" />
      </div>
    );
  }
  const { batch } = trace.data;
  return (
    <>
      <PageTitle title={`Batch of ${batch.lotName} · Roastery`} />
      <PageHeader
        eyebrow="Roastery · Trace"
        title={`Batch of ${batch.lotName}, ${roastLevelLabels[batch.roastLevel]}`}
        lead={
          <>
            Every order this batch went into, for a recall.{' '}
            <Link to={paths.roastery.daySheet.getHref(batch.roastDate)} className="font-semibold text-leaf underline">
              Open its Day Sheet
            </Link>
          </>
        }
      />
      <BatchTraceView trace={trace.data} />
    </>
  );
}
