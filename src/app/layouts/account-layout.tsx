import clsx from 'clsx';
import { UserRound } from 'lucide-react';
import { NavLink, Outlet } from 'react-router-dom';
import { paths } from '@/config/paths';
import { RequireRole } from '@/features/auth/components/require-role';
import { signedInLoader } from '@/features/auth/utils/require-user';
import { everyRole } from '@/features/auth/utils/roles';

/** A visitor is sent to sign in first, and brought back here afterwards. */
export const clientLoader = signedInLoader;

const accountNav = [
  { to: paths.account.overview.getHref(), label: 'Overview', end: true },
  { to: paths.account.profile.getHref(), label: 'Profile', end: false },
  { to: paths.account.orders.getHref(), label: 'Orders', end: false },
  { to: paths.account.deliveries.getHref(), label: 'Deliveries', end: false },
  { to: paths.account.journal.getHref(), label: 'Roast Journal', end: false },
  { to: paths.account.addresses.getHref(), label: 'Addresses', end: false },
];

function navLinkStyles({ isActive }: { isActive: boolean }): string {
  return clsx(
    'inline-flex min-h-11 items-center whitespace-nowrap rounded-control px-3 text-small font-semibold no-underline',
    isActive ? 'bg-leaf-wash text-leaf-deep' : 'text-ink hover:bg-paper-shade',
  );
}

/** The signed-in person's own area, inside the shop's frame. */
export default function AccountLayout() {
  return (
    <div>
      <div className="mb-6 flex flex-wrap items-center justify-between gap-x-6 gap-y-1 border-b border-rule pb-2">
        <p className="flex items-center gap-2 text-small font-semibold tracking-wide text-ember uppercase">
          <UserRound aria-hidden="true" className="size-4" />
          Your account
        </p>
        <nav aria-label="Account" className="-mx-3 overflow-x-auto sm:mx-0">
          <ul className="flex gap-1">
            {accountNav.map((item) => (
              <li key={item.to}>
                <NavLink to={item.to} end={item.end} className={navLinkStyles}>
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </div>
      <RequireRole allowed={everyRole}>
        <Outlet />
      </RequireRole>
    </div>
  );
}
