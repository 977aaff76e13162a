import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunction, RouteObject } from 'react-router-dom';
import { RouteErrorBoundary } from '@/components/errors/route-error-boundary';
import { PageLoading } from '@/components/ui/page-loading';
import { paths } from '@/config/paths';
import { AppRoot } from './layouts/app-root';

/** What a lazily loaded route or layout module exports. */
type RouteModule = {
  default: ComponentType;
  /** Starts the page's queries as soon as the route matches, with the options its hooks use. */
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
};

function toRoute(queryClient: QueryClient) {
  return (module: RouteModule) => ({
    Component: module.default,
    ...(module.clientLoader ? { loader: module.clientLoader(queryClient) } : {}),
  });
}

/** Every route of the SPA; each page and layout loads lazily. Used by the browser, the server render and tests. */
export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  const load = toRoute(queryClient);
  return [
    {
      id: 'root',
      Component: AppRoot,
      errorElement: <RouteErrorBoundary standalone />,
      hydrateFallbackElement: <PageLoading />,
      children: [
        {
          lazy: () => import('./layouts/shop-layout').then(load),
          children: [
            {
              errorElement: <RouteErrorBoundary />,
              children: [
                { index: true, lazy: () => import('./routes/shop/home').then(load) },
                { path: paths.lots.path, lazy: () => import('./routes/shop/lots').then(load) },
                { path: paths.lot.path, lazy: () => import('./routes/shop/lot').then(load) },
                { path: paths.roastingBasics.path, lazy: () => import('./routes/shop/roasting-basics').then(load) },
                { path: paths.subscribe.path, lazy: () => import('./routes/shop/subscribe').then(load) },
                { path: paths.subscribeShipping.path, lazy: () => import('./routes/shop/subscribe-shipping').then(load) },
                { path: paths.subscription.path, lazy: () => import('./routes/shop/subscription').then(load) },
                { path: paths.cart.path, lazy: () => import('./routes/shop/cart').then(load) },
                { path: paths.checkout.path, lazy: () => import('./routes/shop/checkout').then(load) },
                { path: paths.order.path, lazy: () => import('./routes/shop/order').then(load) },
                { path: paths.signIn.path, lazy: () => import('./routes/auth/sign-in').then(load) },
                { path: paths.createAccount.path, lazy: () => import('./routes/auth/create-account').then(load) },
                { path: paths.forgotPassword.path, lazy: () => import('./routes/auth/forgot-password').then(load) },
                { path: paths.resetPassword.path, lazy: () => import('./routes/auth/reset-password').then(load) },
                { path: paths.join.path, lazy: () => import('./routes/auth/join').then(load) },
                {
                  path: paths.account.overview.path,
                  lazy: () => import('./layouts/account-layout').then(load),
                  children: [
                    { index: true, lazy: () => import('./routes/account/overview').then(load) },
                    { path: paths.account.profile.path, lazy: () => import('./routes/account/profile').then(load) },
                    { path: paths.account.addresses.path, lazy: () => import('./routes/account/addresses').then(load) },
                    { path: paths.account.orders.path, lazy: () => import('./routes/account/orders').then(load) },
                    { path: paths.account.deliveries.path, lazy: () => import('./routes/account/deliveries').then(load) },
                    { path: paths.account.journal.path, lazy: () => import('./routes/account/journal').then(load) },
                  ],
                },
                { path: '*', lazy: () => import('./routes/shop/not-found').then(load) },
              ],
            },
          ],
        },
        {
          path: paths.roastery.overview.path,
          lazy: () => import('./layouts/roastery-layout').then(load),
          children: [
            {
              errorElement: <RouteErrorBoundary />,
              children: [
                { index: true, lazy: () => import('./routes/roastery/overview').then(load) },
                { path: paths.roastery.greenStock.path, lazy: () => import('./routes/roastery/green-stock').then(load) },
                { path: paths.roastery.newLot.path, lazy: () => import('./routes/roastery/lot-editor-new').then(load) },
                { path: paths.roastery.lot.path, lazy: () => import('./routes/roastery/lot-editor').then(load) },
                { path: paths.roastery.orders.path, lazy: () => import('./routes/roastery/orders').then(load) },
                { path: paths.roastery.order.path, lazy: () => import('./routes/roastery/order').then(load) },
                { path: paths.roastery.team.path, lazy: () => import('./routes/roastery/team').then(load) },
                { path: paths.roastery.subscribers.path, lazy: () => import('./routes/roastery/subscribers').then(load) },
                { path: paths.roastery.subscriber.path, lazy: () => import('./routes/roastery/subscriber').then(load) },
                { path: paths.roastery.rotation.path, lazy: () => import('./routes/roastery/rotation').then(load) },
                { path: paths.roastery.calendar.path, lazy: () => import('./routes/roastery/calendar').then(load) },
                { path: paths.roastery.daySheetToday.path, lazy: () => import('./routes/roastery/day-sheet-today').then(load) },
                { path: paths.roastery.daySheet.path, lazy: () => import('./routes/roastery/day-sheet').then(load) },
                { path: paths.roastery.batch.path, lazy: () => import('./routes/roastery/batch-trace').then(load) },
                { path: paths.roastery.orderTrace.path, lazy: () => import('./routes/roastery/order-trace').then(load) },
                { path: paths.roastery.settings.path, lazy: () => import('./routes/roastery/settings').then(load) },
                { path: paths.roastery.ledger.path, lazy: () => import('./routes/roastery/ledger').then(load) },
              ],
            },
          ],
        },
      ],
    },
  ];
}
