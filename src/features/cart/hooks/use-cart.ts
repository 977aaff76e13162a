import { useSyncExternalStore } from 'react';
import { cartStore, type CartLine } from '../stores/cart-store';

const serverSnapshot = (): readonly CartLine[] => [];

/** The cart's lines, its bag count, and the ways to change it; every tab and component stays in step. */
export function useCart() {
  const lines = useSyncExternalStore(cartStore.subscribe, cartStore.getSnapshot, serverSnapshot);
  const count = lines.reduce((sum, line) => sum + line.quantity, 0);
  return {
    lines,
    count,
    add: cartStore.add,
    setQuantity: cartStore.setQuantity,
    remove: cartStore.remove,
    clear: cartStore.clear,
  };
}
