import { Outlet, ScrollRestoration } from 'react-router-dom';

/** The outermost route: every area renders inside it. */
export function AppRoot() {
  return (
    <>
      <Outlet />
      <ScrollRestoration />
    </>
  );
}
