import { Link, useSearchParams } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { CartLines } from '@/features/cart/components/cart-lines';
import { useCart } from '@/features/cart/hooks/use-cart';

export default function CartRoute() {
  const { lines } = useCart();
  const user = useCurrentUser().data;
  const [search] = useSearchParams();
  const cancelled = search.get('checkout') === 'cancelled';

  return (
    <>
      <PageTitle title="Cart" />
      <PageHeader title="Your cart" />
      {cancelled ? (
        <div className="mb-6">
          <FormAlert tone="status">Payment was not completed and nothing was charged. Your bags are still in the cart.</FormAlert>
        </div>
      ) : null}
      {lines.length === 0 ? (
        <EmptyState
          title="Your cart is empty"
          action={
            <Link to={paths.lots.getHref()} className={buttonStyles('primary')}>
              Browse Green Lots
            </Link>
          }
        >
          Pick a lot and a bag size, and it will wait here, even after you sign in.
        </EmptyState>
      ) : (
        <div className="max-w-3xl">
          <CartLines editable />
          <div className="mt-6 flex flex-wrap justify-end gap-3">
            <Link to={paths.lots.getHref()} className={buttonStyles('secondary')}>
              Keep browsing
            </Link>
            <Link to={paths.checkout.getHref()} className={buttonStyles('primary')}>
              Check out
            </Link>
          </div>
          {user === null ? (
            <p className="mt-3 text-right text-small text-ink-muted">You sign in or create an account at checkout; these bags stay in your cart.</p>
          ) : null}
        </div>
      )}
    </>
  );
}
