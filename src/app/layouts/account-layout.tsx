import { UserRound } from 'lucide-react';
import { Outlet } from 'react-router-dom';

/** The customer's own area, inside the shop's frame. */
export default function AccountLayout() {
  return (
    <div>
      <p className="mb-6 flex items-center gap-2 border-b border-rule pb-3 text-small font-semibold tracking-wide text-ember uppercase">
        <UserRound aria-hidden="true" className="size-4" />
        Your account
      </p>
      <Outlet />
    </div>
  );
}
