import { Download } from 'lucide-react';
import { Link } from 'react-router-dom';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import { Badge } from '@/components/ui/badge';
import { Button, buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useShopMoney } from '@/lib/shop-currency';
import { bagsLabel, cadenceLabel, subscriptionStatusLabels } from '@/lib/subscription-labels';
import { formatDayWithWeekday } from '@/lib/dates';
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
  const csvLink = (
    <a href={subscribersCsvHref(filters)} download className={buttonStyles('secondary')}>
      <Download aria-hidden="true" className="size-4" />
      Download these as CSV
    </a>
  );

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
      <div className="overflow-x-auto rounded-card border border-rule bg-sheet">
        <table className="w-full min-w-[48rem] border-collapse text-left text-small">
          <caption className="sr-only">Subscribers, page {page} of {pages}</caption>
          <thead className="bg-paper-shade">
            <tr>
              {['Customer', 'Coffee', 'Roast level', 'Each delivery', 'Cadence', 'Status', 'Next roast', 'Per delivery'].map((column) => (
                <th key={column} scope="col" className="px-3 py-2 font-semibold whitespace-nowrap">
                  {column}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-rule">
            {items.map((row) => {
              const status = subscriptionStatusLabels[row.status];
              return (
                <tr key={row.id}>
                  <th scope="row" className="px-3 py-2 text-left font-normal">
                    <Link to={paths.roastery.subscriber.getHref(row.id)} className="font-semibold text-leaf underline">
                      {row.customerName}
                    </Link>
                    <span className="block text-caption break-all text-ink-muted">{row.email}</span>
                  </th>
                  <td className="px-3 py-2">{row.coffee}</td>
                  <td className="px-3 py-2">{roastLevelLabels[row.roastLevel]}</td>
                  <td className="px-3 py-2 whitespace-nowrap">{bagsLabel(row.bagsPerDelivery, row.bagSize)}</td>
                  <td className="px-3 py-2 whitespace-nowrap">{cadenceLabel(row.cadenceWeeks)}</td>
                  <td className="px-3 py-2">
                    <Badge tone={status.tone}>{status.label}</Badge>
                  </td>
                  <td className="px-3 py-2 whitespace-nowrap">{row.nextRoastDate ? formatDayWithWeekday(row.nextRoastDate) : '—'}</td>
                  <td className="px-3 py-2 text-right">{money(row.priceCents)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
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
