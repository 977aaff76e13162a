import clsx from 'clsx';
import { useQuery } from '@tanstack/react-query';
import { ArrowLeft } from 'lucide-react';
import { Link, matchPath, NavLink, Outlet, useLocation } from 'react-router-dom';
import type { Role } from '@shared/domain/vocabulary';
import { RestdayMark } from '@/components/brand/restday-mark';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { AccountMenu } from '@/features/auth/components/account-menu';
import { RequireRole } from '@/features/auth/components/require-role';
import { signedInLoader } from '@/features/auth/utils/require-user';
import { getShopSettingsQueryOptions } from '@/features/shop-settings/api/get-shop-settings';
import { ShopTimeZoneProvider } from '@/lib/shop-clock';
import { ownerRoles, roasteryRoles, staffRoles } from '@/features/auth/utils/roles';
import { NavigationProgress } from './navigation-progress';
import { SkipLink } from './skip-link';

/** A visitor is sent to sign in first; the page then shows a customer why it is closed to them. */
export const clientLoader = signedInLoader;

type NavItem = { to: string; label: string; end: boolean; roles: readonly Role[] };

/** The Roastery's places, each shown to the roles whose work it is (the server refuses the rest). */
const roasteryNav: NavItem[] = [
  { to: paths.roastery.overview.getHref(), label: 'Today', end: true, roles: staffRoles },
  { to: paths.roastery.daySheetToday.getHref(), label: 'Day Sheet', end: false, roles: roasteryRoles },
  { to: paths.roastery.calendar.getHref(), label: 'Roast Calendar', end: false, roles: staffRoles },
  { to: paths.roastery.orders.getHref(), label: 'Orders', end: false, roles: roasteryRoles },
  { to: paths.roastery.greenStock.getHref(), label: 'Green Stock', end: false, roles: staffRoles },
  { to: paths.roastery.subscribers.getHref(), label: 'Subscribers', end: false, roles: staffRoles },
  { to: paths.roastery.rotation.getHref(), label: 'Rotation', end: false, roles: staffRoles },
  { to: paths.roastery.ledger.getHref(), label: 'Ledger', end: false, roles: ownerRoles },
  { to: paths.roastery.team.getHref(), label: 'Team', end: false, roles: ownerRoles },
  { to: paths.roastery.settings.getHref(), label: 'Settings', end: false, roles: ownerRoles },
];

/** The pages a packer works on: the Day Sheet (its Pack List) and the orders. Every other Roastery page is for staff. */
const packerPagePaths = [paths.roastery.daySheetToday.path, paths.roastery.daySheet.path, paths.roastery.orders.path, paths.roastery.order.path];
const isPackerPage = (pathname: string) => packerPagePaths.some((path) => matchPath(path, pathname) !== null);

function navLinkStyles({ isActive }: { isActive: boolean }): string {
  return clsx(
    'inline-flex min-h-11 items-center whitespace-nowrap rounded-control px-2 text-small font-semibold no-underline sm:px-3 sm:text-body',
    isActive ? 'bg-crema text-ink' : 'text-paper hover:bg-paper/10',
  );
}

/** The staff's Roastery: its own dark header, so nobody mistakes it for the shop. */
export default function RoasteryLayout() {
  const role = useCurrentUser().data?.role;
  const nav = role ? roasteryNav.filter((item) => item.roles.includes(role)) : [];
  const { pathname } = useLocation();
  // One clock on every staff page: the shop's time zone, from the settings the whole team reads.
  const timeZone = useQuery({ ...getShopSettingsQueryOptions(), enabled: role !== undefined && roasteryRoles.includes(role) }).data?.timeZone;
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <NavigationProgress />
      <header className="bg-ink text-paper print:hidden [&_:focus-visible]:outline-crema">
        <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-4 gap-y-1 px-4 py-2 sm:px-6">
          <Link
            to={paths.roastery.overview.getHref()}
            className="mr-2 inline-flex min-h-11 items-center gap-2 font-heading font-semibold text-h3 text-paper no-underline"
          >
            <RestdayMark className="size-8" />
            Restday <span className="text-crema">Roastery</span>
          </Link>
          {role && roasteryRoles.includes(role) ? (
            <nav aria-label="Roastery" className="order-last -mx-4 w-[calc(100%+2rem)] overflow-x-auto px-2 sm:mx-0 sm:w-full sm:overflow-visible sm:px-0">
              {/* Its own row under the name: nine places for the owner never fit beside it. */}
              <ul className="flex gap-1 sm:flex-wrap">
                {nav.map((item) => (
                  <li key={item.to}>
                    <NavLink to={item.to} end={item.end} className={navLinkStyles}>
                      {item.label}
                    </NavLink>
                  </li>
                ))}
              </ul>
            </nav>
          ) : null}
          <Link to={paths.home.getHref()} className="ml-auto inline-flex min-h-11 items-center gap-1.5 text-small font-semibold text-paper underline">
            <ArrowLeft aria-hidden="true" className="size-4" />
            <span className="sm:hidden">Shop</span>
            <span className="hidden sm:inline">Back to the shop</span>
          </Link>
          <AccountMenu tone="roastery" />
        </div>
      </header>

      <main id="main" className="mx-auto w-full max-w-page flex-1 px-4 py-8 sm:px-6 sm:py-10">
        <RequireRole
          allowed={isPackerPage(pathname) ? roasteryRoles : staffRoles}
          notAllowed={
            role === 'packer'
              ? { title: 'This page is for the roasting staff', reason: 'Your work is on the Day Sheet’s Pack List and in Orders, in the menu above.' }
              : {
                  title: 'The Roastery is for the shop’s team',
                  reason: 'It is where staff plan roast days and pack orders. Your orders and Deliveries are in your account.',
                }
          }
        >
          <ShopTimeZoneProvider value={timeZone}>
            <Outlet />
          </ShopTimeZoneProvider>
        </RequireRole>
      </main>
    </div>
  );
}
