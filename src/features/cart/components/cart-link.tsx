import clsx from 'clsx';
import { ShoppingBag } from 'lucide-react';
import { NavLink } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useCart } from '../hooks/use-cart';

/** The header's cart, with how many bags are in it. */
export function CartLink() {
  const { count } = useCart();
  return (
    <NavLink
      to={paths.cart.getHref()}
      aria-label={count === 0 ? 'Cart, empty' : `Cart, ${count} ${count === 1 ? 'bag' : 'bags'}`}
      className={({ isActive }) =>
        clsx(
          'inline-flex min-h-11 items-center gap-1.5 whitespace-nowrap rounded-control px-2 text-small font-semibold no-underline sm:px-3 sm:text-body',
          isActive ? 'bg-leaf-wash text-leaf-deep' : 'text-ink hover:bg-paper-shade',
        )
      }
    >
      <ShoppingBag aria-hidden="true" className="size-5" />
      <span aria-hidden="true">Cart</span>
      {count > 0 ? (
        <span aria-hidden="true" className="rounded-pill bg-ember px-2 text-caption font-semibold text-sheet">
          {count}
        </span>
      ) : null}
    </NavLink>
  );
}
