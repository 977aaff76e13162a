import { ArrowRight, Flame, KeyRound, MapPin, Package } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { useSubscriptions } from '@/features/subscriptions/api/get-subscriptions';
import { formatDayWithWeekday } from '@/lib/dates';

function AccountCard({ to, icon, title, children }: { to: string; icon: ReactNode; title: string; children: ReactNode }) {
  return (
    <li className="rounded-card border border-rule bg-sheet p-5 shadow-card">
      <h2 className="flex items-center gap-2 text-h3">
        {icon}
        <Link to={to} className="text-ink no-underline hover:underline">
          {title}
        </Link>
      </h2>
      <p className="mt-2 text-ink-muted">{children}</p>
      <p className="mt-3 inline-flex items-center gap-1 text-small font-semibold text-leaf" aria-hidden="true">
        Open
        <ArrowRight className="size-4" />
      </p>
    </li>
  );
}

/** The soonest delivery of the customer's subscriptions, with its roast, ship and ready-from days. */
function NextDelivery() {
  const subscriptions = useSubscriptions().data?.items ?? [];
  const next = subscriptions
    .flatMap((subscription) => (subscription.nextDelivery ? [{ subscription, delivery: subscription.nextDelivery }] : []))
    .sort((a, b) => a.delivery.roastDate.localeCompare(b.delivery.roastDate))[0];
  if (!next) return null;
  const { subscription, delivery } = next;
  const days: [string, string][] = [
    ['Roasted', delivery.roastDate],
    ['Ships', delivery.shipDate],
    ['Ready from', delivery.readyFrom],
  ];
  return (
    <section aria-labelledby="next-delivery-heading" className="mb-8 rounded-card border border-rule bg-leaf-wash/40 p-5">
      <h2 id="next-delivery-heading" className="text-h3">
        Next delivery
      </h2>
      <p className="mt-1 text-ink-muted">{delivery.coffee ?? subscription.coffee}</p>
      <dl className="mt-3 grid gap-3 sm:grid-cols-3">
        {days.map(([term, day]) => (
          <div key={term}>
            <dt className="text-small text-ink-muted">{term}</dt>
            <dd className="font-semibold">{formatDayWithWeekday(day)}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3">
        <Link to={paths.account.deliveries.getHref()} className="font-semibold text-leaf underline">
          See your deliveries
        </Link>
      </p>
    </section>
  );
}

export default function AccountOverviewRoute() {
  // The account layout shows this page only once the session is known.
  const user = useCurrentUser().data;
  if (!user) return null;

  return (
    <>
      <PageTitle title="Your account" />
      <header className="mb-8">
        <h1 className="text-h1">Hello, {user.name}</h1>
        <p className="mt-2 text-ink-muted">
          Signed in as <span className="font-semibold break-all text-ink">{user.email}</span>
        </p>
      </header>

      <NextDelivery />

      <ul className="grid gap-4 sm:grid-cols-2">
        <AccountCard to={paths.account.profile.getHref()} icon={<KeyRound aria-hidden="true" className="size-5 text-ember" />} title="Profile">
          Your name, the e-mail address you sign in with, and your password.
        </AccountCard>
        <AccountCard to={paths.account.orders.getHref()} icon={<Package aria-hidden="true" className="size-5 text-ember" />} title="Orders">
          Everything you have ordered, where each order is, and its tracking once it ships.
        </AccountCard>
        <AccountCard to={paths.account.journal.getHref()} icon={<Flame aria-hidden="true" className="size-5 text-ember" />} title="Roast Journal">
          Your home roasts: weight loss, development time and the level each one reached, against the lot&rsquo;s Home Roast Guide.
        </AccountCard>
        <AccountCard to={paths.account.addresses.getHref()} icon={<MapPin aria-hidden="true" className="size-5 text-ember" />} title="Addresses">
          Where your green coffee and subscription bags ship, and which one checkout offers first.
        </AccountCard>
      </ul>

      <p className="mt-8 max-w-prose text-ink-muted">
        Your upcoming Deliveries will appear here as they open in the shop. Meanwhile,{' '}
        <Link to={paths.lots.getHref()} className="font-semibold text-leaf underline">
          browse Green Lots
        </Link>
        .
      </p>
    </>
  );
}
