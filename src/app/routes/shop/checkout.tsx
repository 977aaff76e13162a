import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { getAddressesQueryOptions, useAddresses } from '@/features/addresses/api/get-addresses';
import { requireUser } from '@/features/auth/utils/require-user';
import { CartLines } from '@/features/cart/components/cart-lines';
import { CheckoutForm } from '@/features/cart/components/checkout-form';
import { useCart } from '@/features/cart/hooks/use-cart';

/** Buying needs an account: a visitor signs in (or creates one) and comes back here, cart intact. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getAddressesQueryOptions());
    return null;
  };

export default function CheckoutRoute() {
  const { lines } = useCart();
  const [lineErrors, setLineErrors] = useState<Record<number, string>>({});
  const addressesQuery = useAddresses();
  // The saved address checkout starts from: the one marked default, which the server lists first.
  const initialAddress = addressesQuery.data?.items[0];

  return (
    <>
      <PageTitle title="Checkout" />
      <PageHeader title="Checkout" />
      {lines.length === 0 ? (
        <EmptyState
          title="Nothing to check out"
          action={
            <Link to={paths.lots.getHref()} className={buttonStyles('primary')}>
              Browse Green Lots
            </Link>
          }
        >
          Your cart is empty.
        </EmptyState>
      ) : (
        <div className="grid gap-10 lg:grid-cols-2">
          <section aria-labelledby="checkout-summary">
            <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
              <h2 id="checkout-summary" className="text-h2">
                Your order
              </h2>
              <Link to={paths.cart.getHref()} className="font-semibold text-leaf underline">
                Change the cart
              </Link>
            </div>
            <CartLines editable={false} lineErrors={lineErrors} />
          </section>
          <section aria-labelledby="checkout-address">
            <h2 id="checkout-address" className="mb-3 text-h2">
              Where it ships
            </h2>
            {addressesQuery.isPending ? (
              <Skeleton className="h-96" />
            ) : (
              <CheckoutForm initialAddress={initialAddress} addressBookEmpty={!initialAddress} onLineErrors={setLineErrors} />
            )}
          </section>
        </div>
      )}
    </>
  );
}
