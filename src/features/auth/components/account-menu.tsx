import clsx from 'clsx';
import { ChevronDown, LogIn, UserRound } from 'lucide-react';
import { useEffect, useId, useRef, useState, type FocusEvent, type KeyboardEvent } from 'react';
import { Link, NavLink, useLocation, useNavigate } from 'react-router-dom';
import type { User } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useCurrentUser } from '../api/get-current-user';
import { useSignOut } from '../api/sign-out';

/** `shop`: the light shop header; `roastery`: the Roastery's dark one. */
type HeaderTone = 'shop' | 'roastery';

const triggerTones: Record<HeaderTone, { idle: string; active: string }> = {
  shop: { idle: 'text-ink hover:bg-paper-shade', active: 'bg-leaf-wash text-leaf-deep' },
  roastery: { idle: 'text-paper hover:bg-paper/10', active: 'bg-crema text-ink' },
};

const triggerBase =
  'inline-flex min-h-11 items-center gap-1.5 whitespace-nowrap rounded-control px-2 text-small font-semibold no-underline sm:px-3 sm:text-body';

/** Pages not worth coming back to after sign-in: the home page (the account page says more) and the sign-in flow itself. */
const noReturnPaths: string[] = [
  paths.home.path,
  paths.signIn.path,
  paths.createAccount.path,
  paths.forgotPassword.path,
  paths.resetPassword.path,
  paths.join.path,
];

/** The header's session corner: "Sign in" for a visitor, the account menu once signed in. */
export function AccountMenu({ tone = 'shop' }: { tone?: HeaderTone }) {
  const userQuery = useCurrentUser();
  const location = useLocation();

  if (userQuery.data) return <SignedInMenu user={userQuery.data} tone={tone} />;
  // Holds the corner's width while the session is checked, so the header does not jump.
  if (userQuery.isPending) return <span aria-hidden="true" className="inline-block min-h-11 w-24" />;

  const comesBack = !noReturnPaths.includes(location.pathname);
  const href = comesBack ? paths.signIn.getHref(`${location.pathname}${location.search}`) : paths.signIn.getHref();
  return (
    <NavLink to={href} className={({ isActive }) => clsx(triggerBase, isActive ? triggerTones[tone].active : triggerTones[tone].idle)}>
      <LogIn aria-hidden="true" className="size-5" />
      Sign in
    </NavLink>
  );
}

function SignedInMenu({ user, tone }: { user: User; tone: HeaderTone }) {
  const [open, setOpen] = useState(false);
  const wrapperRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const panelId = useId();
  const navigate = useNavigate();
  // Leave the page first: it may be one only a signed-in person can see.
  const signOut = useSignOut({ onSignedOut: () => navigate(paths.home.getHref()) });

  useEffect(() => {
    if (!open) return;
    function closeOnOutsidePointer(event: PointerEvent) {
      if (event.target instanceof Node && !wrapperRef.current?.contains(event.target)) setOpen(false);
    }
    document.addEventListener('pointerdown', closeOnOutsidePointer);
    return () => document.removeEventListener('pointerdown', closeOnOutsidePointer);
  }, [open]);

  function closeOnEscape(event: KeyboardEvent<HTMLDivElement>) {
    if (event.key !== 'Escape' || !open) return;
    setOpen(false);
    buttonRef.current?.focus();
  }

  function closeWhenFocusLeaves(event: FocusEvent<HTMLDivElement>) {
    if (open && !(event.relatedTarget instanceof Node && event.currentTarget.contains(event.relatedTarget))) setOpen(false);
  }

  const close = () => setOpen(false);
  const itemStyles = 'flex min-h-11 w-full items-center rounded-control px-3 text-left font-semibold text-ink no-underline hover:bg-paper-shade';

  return (
    <div ref={wrapperRef} className="relative" onKeyDown={closeOnEscape} onBlur={closeWhenFocusLeaves}>
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((isOpen) => !isOpen)}
        className={clsx(triggerBase, open ? triggerTones[tone].active : triggerTones[tone].idle)}
      >
        <UserRound aria-hidden="true" className="size-5 shrink-0" />
        <span className="sr-only">Account menu: </span>
        <span className="max-w-32 truncate sm:max-w-48">{user.name}</span>
        <ChevronDown aria-hidden="true" className={clsx('size-4 shrink-0 transition-transform', open && 'rotate-180')} />
      </button>

      <div
        id={panelId}
        hidden={!open}
        // The panel is light even in the Roastery's dark header, so it keeps the usual focus ring.
        className="absolute top-full right-0 z-40 mt-1 w-72 max-w-[calc(100vw-2rem)] rounded-card border border-rule bg-sheet p-2 text-body text-ink shadow-card [&_a:focus-visible]:outline-focus [&_button:focus-visible]:outline-focus"
      >
        <p className="px-3 pt-1 pb-2 text-small text-ink-muted">
          Signed in as <span className="font-semibold break-all text-ink">{user.email}</span>
        </p>
        <ul className="border-t border-rule pt-1">
          <li>
            <Link to={paths.account.overview.getHref()} onClick={close} className={itemStyles}>
              Your account
            </Link>
          </li>
          <li>
            <Link to={paths.account.profile.getHref()} onClick={close} className={itemStyles}>
              Profile and password
            </Link>
          </li>
          <li>
            <Link to={paths.account.addresses.getHref()} onClick={close} className={itemStyles}>
              Addresses
            </Link>
          </li>
        </ul>
        <div className="mt-1 border-t border-rule pt-1">
          <button type="button" onClick={() => signOut.mutate()} disabled={signOut.isPending} className={itemStyles}>
            {signOut.isPending ? 'Signing out…' : 'Sign out'}
          </button>
          {signOut.isError ? (
            <p role="alert" className="px-3 pt-1 text-small font-semibold text-alert">
              {signOut.error instanceof ApiError ? signOut.error.message : 'Signing out did not work. Please try again.'}
            </p>
          ) : null}
        </div>
      </div>
    </div>
  );
}
