import { Warehouse } from 'lucide-react';
import { NavLink } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useCurrentUser } from '../api/get-current-user';
import { roasteryRoles } from '../utils/roles';

/** The way into the Roastery, in the shop's header, for the shop's team only. */
export function RoasteryLink() {
  const user = useCurrentUser().data;
  if (!user || !roasteryRoles.includes(user.role)) return null;
  return (
    <NavLink
      to={paths.roastery.overview.getHref()}
      className="inline-flex min-h-11 items-center gap-1.5 whitespace-nowrap rounded-control px-2 text-small font-semibold text-ember no-underline hover:bg-ember-wash sm:px-3 sm:text-body"
    >
      <Warehouse aria-hidden="true" className="size-5" />
      Roastery
    </NavLink>
  );
}
