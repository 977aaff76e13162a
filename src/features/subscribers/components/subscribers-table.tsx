import { Link } from 'react-router-dom';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useShopMoney } from '@/lib/shop-currency';
import { bagsLabel, cadenceLabel, subscriptionStatusLabels } from '@/lib/subscription-labels';
import { formatDayWithWeekday } from '@/lib/dates';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { DownloadLink } from '@/components/ui/download-link';
import { subscribersCsvHref, useSubscribers } from '../api/get-subscribers';
import type { SubscriberFilters } from '../utils/subscriber-filters';

type SubscribersTableProps = {
  filters: SubscriberFilters;
  onPageChange: (page: number) => void;
};

/** One page of subscribers for the filters, with paging and the CSV of every match. */
export function SubscribersTable({ filters, onPageChange }: SubscribersTableProps) {
  const { money } = useShopMoney();
  const subscribersQuery = useSubscribers(filters);
  const csvLink = <DownloadLink href={subscribersCsvHref(filters)}>Download these as CSV</DownloadLink>;

  if (subscribersQuery.isError) {
    return <ErrorState title="Subscribers could not load" error={subscribersQuery.error} onRetry={() => void subscribersQuery.refetch()} />;
  }
  if (!subscribersQuery.data) {
    return (
      <>
        <p role="status" className="sr-only">
          Loading subscribers…
        </p>
        <Skeleton className="h-72 rounded-card" />
      </>
    );
  }
  const { items, total, page, pageSize } = subscribersQuery.data;
  if (items.length === 0) {
    return <EmptyState title="No subscribers match">Change or clear a filter to see more.</EmptyState>;
  }
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <div className="grid gap-4" aria-busy={subscribersQuery.isPlaceholderData}>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p role="status" className="text-small text-ink-muted">
          {total} {total === 1 ? 'subscriber' : 'subscribers'}
        </p>
        {csvLink}
      </div>
      <TableFrame>
        <Table className="min-w-[48rem]">
          <caption className="sr-only">
            Subscribers, page {page} of {pages}
          </caption>
          <TableHead>
            <tr>
              {['Customer', 'Coffee', 'Roast level', 'Each delivery', 'Cadence', 'Status', 'Next roast', 'Per delivery'].map((column) => (
                <TableHeader key={column} className="whitespace-nowrap">
                  {column}
                </TableHeader>
              ))}
            </tr>
          </TableHead>
          <TableBody>
            {items.map((row) => {
              const status = subscriptionStatusLabels[row.status];
              return (
                <tr key={row.id}>
                  <TableRowHeader>
                    <Link to={paths.roastery.subscriber.getHref(row.id)} className="font-semibold text-leaf underline">
                      {row.customerName}
                    </Link>
                    <span className="block text-caption break-all text-ink-muted">{row.email}</span>
                  </TableRowHeader>
                  <TableCell>{row.coffee}</TableCell>
                  <TableCell>{roastLevelLabels[row.roastLevel]}</TableCell>
                  <TableCell className="whitespace-nowrap">{bagsLabel(row.bagsPerDelivery, row.bagSize)}</TableCell>
                  <TableCell className="whitespace-nowrap">{cadenceLabel(row.cadenceWeeks)}</TableCell>
                  <TableCell>
                    <Badge tone={status.tone}>{status.label}</Badge>
                  </TableCell>
                  <TableCell className="whitespace-nowrap">{row.nextRoastDate ? formatDayWithWeekday(row.nextRoastDate) : '—'}</TableCell>
                  <TableCell align="right">{money(row.priceCents)}</TableCell>
                </tr>
              );
            })}
          </TableBody>
        </Table>
      </TableFrame>
      {pages > 1 ? (
        <nav aria-label="Pages of subscribers" className="flex items-center gap-3">
          <Button variant="secondary" disabled={page <= 1} onClick={() => onPageChange(page - 1)}>
            Previous page
          </Button>
          <span className="text-small">
            Page {page} of {pages}
          </span>
          <Button variant="secondary" disabled={page >= pages} onClick={() => onPageChange(page + 1)}>
            Next page
          </Button>
        </nav>
      ) : null}
    </div>
  );
}
