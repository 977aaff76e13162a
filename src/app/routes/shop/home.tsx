import type { QueryClient } from '@tanstack/react-query';
import { ArrowRight, CalendarClock, Sprout } from 'lucide-react';
import { Link } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { getLotsQueryOptions } from '@/features/lots/api/get-lots';
import { FeaturedLots } from '@/features/lots/components/featured-lots';

export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getLotsQueryOptions());
  return null;
};

const offers = [
  {
    icon: Sprout,
    title: 'Green Lots for home roasters',
    text: 'Unroasted coffee sold by weight, from an 8 oz sample to a 5 lb bag. Every lot comes with its origin, process, variety, altitude, crop year and moisture, tasting notes, and the roast level we suggest for it.',
    link: { to: paths.lots.getHref(), label: 'Browse Green Lots' },
  },
  {
    icon: CalendarClock,
    title: 'Roasted to Order',
    text: 'A subscription roasted for you on the next roast day, rested while it gives off CO₂, and shipped so it is ready to brew when it arrives. Choose the coffee, roast level, bag size, grind and how often.',
    link: { to: paths.subscribe.getHref(), label: 'How Roasted to Order works' },
  },
];

export default function HomeRoute() {
  return (
    <>
      <PageTitle title="Green coffee for home roasters, and coffee roasted to order" />

      <section className="grid gap-8 py-4 lg:grid-cols-[3fr_2fr] lg:items-center">
        <div>
          <p className="text-small font-semibold tracking-wide text-ember uppercase">Green coffee · Roasted to order</p>
          <h1 className="mt-2 text-display">Roast it yourself, or let it rest until it&rsquo;s ready.</h1>
          <p className="mt-4 max-w-prose text-lead text-ink-muted">
            Green lots for people who roast at home, and coffee roasted to order for people who would rather brew. Either way you know where it grew, how it was
            processed and when it is at its best.
          </p>
          <div className="mt-6 flex flex-wrap gap-3">
            <Link to={paths.lots.getHref()} className={buttonStyles('primary')}>
              Browse Green Lots
            </Link>
            <Link to={paths.subscribe.getHref()} className={buttonStyles('secondary')}>
              Roasted to Order
            </Link>
          </div>
        </div>
        <ul className="grid gap-4">
          {offers.map((offer) => (
            <li key={offer.title} className="rounded-card border border-rule bg-sheet p-5 shadow-card">
              <h2 className="flex items-center gap-2 text-h3">
                <offer.icon aria-hidden="true" className="size-5 shrink-0 text-leaf" />
                {offer.title}
              </h2>
              <p className="mt-2 text-ink-muted">{offer.text}</p>
              <Link to={offer.link.to} className="mt-3 inline-flex min-h-11 items-center gap-1 font-semibold text-leaf underline">
                {offer.link.label}
                <ArrowRight aria-hidden="true" className="size-4" />
              </Link>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="featured-lots" className="mt-12">
        <div className="mb-5 flex flex-wrap items-end justify-between gap-2">
          <h2 id="featured-lots" className="text-h2">
            On the green shelf
          </h2>
          <Link to={paths.lots.getHref(new URLSearchParams({ inStock: 'true' }))} className="font-semibold text-leaf underline">
            All lots in stock
          </Link>
        </div>
        <FeaturedLots />
      </section>

      <section aria-labelledby="roasting-basics" className="mt-12 rounded-card bg-leaf-wash p-6 sm:p-8">
        <h2 id="roasting-basics" className="text-h2">
          New to roasting at home?
        </h2>
        <p className="mt-2 max-w-prose text-ink">
          A hot-air popper, a colander and a window you can open are enough to start. Read what happens in the beans, how long to go after first crack, and how
          to roast safely.
        </p>
        <Link to={paths.roastingBasics.getHref()} className={buttonStyles('primary', 'mt-5')}>
          Read the roasting basics
        </Link>
      </section>
    </>
  );
}
