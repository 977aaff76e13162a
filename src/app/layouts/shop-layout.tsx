import type { QueryClient } from '@tanstack/react-query';
import clsx from 'clsx';
import { Link, NavLink, Outlet } from 'react-router-dom';
import { RestdayMark } from '@/components/brand/restday-mark';
import { paths } from '@/config/paths';
import { getCurrentUserQueryOptions } from '@/features/auth/api/get-current-user';
import { AccountMenu } from '@/features/auth/components/account-menu';
import { CartLink } from '@/features/cart/components/cart-link';
import { RoasteryLink } from '@/features/auth/components/roastery-link';
import { NavigationProgress } from './navigation-progress';
import { SkipLink } from './skip-link';

/** The header shows who is signed in; ask as soon as the shop's frame loads. */
export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getCurrentUserQueryOptions());
  return null;
};

const shopNav = [
  { to: paths.lots.getHref(), label: 'Green Lots' },
  { to: paths.subscribe.getHref(), label: 'Roasted to Order' },
  { to: paths.roastingBasics.getHref(), label: 'Roasting basics' },
];

function navLinkStyles({ isActive }: { isActive: boolean }): string {
  return clsx(
    'inline-flex min-h-11 items-center whitespace-nowrap rounded-control px-2 text-small font-semibold no-underline sm:px-3 sm:text-body',
    isActive ? 'bg-leaf-wash text-leaf-deep' : 'text-ink hover:bg-paper-shade',
  );
}

/** The public shop: header with the catalog's sections, the page, and a footer. */
export default function ShopLayout() {
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <NavigationProgress />
      <header className="border-b border-rule bg-sheet">
        <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-4 gap-y-1 px-4 py-2 sm:flex-nowrap sm:px-6">
          <Link to={paths.home.getHref()} className="mr-2 inline-flex min-h-11 items-center gap-2 font-heading font-semibold text-h3 text-ink no-underline">
            <RestdayMark className="size-8" />
            Restday
          </Link>
          <nav aria-label="Shop" className="order-last -mx-4 w-[calc(100%+2rem)] overflow-x-auto px-2 sm:order-none sm:mx-0 sm:w-auto sm:px-0">
            <ul className="flex justify-between gap-0.5 sm:justify-start sm:gap-1">
              {shopNav.map((item) => (
                <li key={item.to}>
                  <NavLink to={item.to} className={navLinkStyles}>
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="ml-auto flex items-center gap-1">
            <RoasteryLink />
            <CartLink />
            <AccountMenu />
          </div>
        </div>
      </header>

      <main id="main" className="mx-auto w-full max-w-page flex-1 px-4 py-8 sm:px-6 sm:py-10">
        <Outlet />
      </main>

      <footer className="border-t border-rule bg-paper-shade">
        <div className="mx-auto grid max-w-page gap-6 px-4 py-8 text-small sm:grid-cols-3 sm:px-6">
          <div>
            <p className="flex items-center gap-2 font-heading font-semibold text-h3">
              <RestdayMark className="size-6" />
              Restday
            </p>
            <p className="mt-2 text-ink-muted">Green coffee for home roasters, and coffee roasted to order.</p>
          </div>
          <nav aria-label="Footer">
            <ul className="flex flex-col gap-1">
              {shopNav.map((item) => (
                <li key={item.to}>
                  <Link to={item.to} className="text-ink underline">
                    {item.label}
                  </Link>
                </li>
              ))}
            </ul>
          </nav>
          <p className="text-ink-muted">
            Roasting at home means heat, smoke and chaff.{' '}
            <Link to={paths.roastingBasics.getHref()} className="text-ink underline">
              Read the roasting basics
            </Link>{' '}
            before your first roast.
          </p>
        </div>
      </footer>
    </div>
  );
}
