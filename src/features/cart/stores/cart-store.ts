import { z } from 'zod';
import { maxBagsPerLine, maxLinesPerOrder, greenCheckoutItemSchema } from '@shared/schemas/checkout';
import { priceBreakSchema } from '@shared/schemas/lots';

/**
 * The cart, kept in this browser's localStorage so a visitor's bags survive reloads and signing in.
 * Each line keeps the lot's prices as they were shown, for the running total; the server prices
 * the order again at checkout.
 */
const cartLineSchema = greenCheckoutItemSchema.extend({
  lotName: z.string(),
  pricePerKgCents: z.number().int().positive(),
  priceBreaks: z.array(priceBreakSchema),
});
export type CartLine = z.infer<typeof cartLineSchema>;

const storedCartSchema = z.object({ version: z.literal(1), lines: z.array(cartLineSchema) });

const STORAGE_KEY = 'restday.cart';
const EMPTY: readonly CartLine[] = [];

type Listener = () => void;
const listeners = new Set<Listener>();
let cachedRaw: string | null = null;
let cachedLines: readonly CartLine[] = EMPTY;

function readRaw(): string | null {
  try {
    return window.localStorage.getItem(STORAGE_KEY);
  } catch {
    return null;
  }
}

function parse(raw: string | null): readonly CartLine[] {
  if (raw === null) return EMPTY;
  try {
    const parsed = storedCartSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data.lines : EMPTY;
  } catch {
    return EMPTY;
  }
}

function emit() {
  for (const listener of listeners) listener();
}

function write(lines: readonly CartLine[]) {
  try {
    if (lines.length === 0) window.localStorage.removeItem(STORAGE_KEY);
    else window.localStorage.setItem(STORAGE_KEY, JSON.stringify({ version: 1, lines }));
  } catch {
    // Storage full or blocked (private mode): the cart still works for this page's life.
    cachedRaw = JSON.stringify({ version: 1, lines });
    cachedLines = lines;
  }
  emit();
}

/** Which line: one per lot and bag size. */
export type CartLineKey = { lotCode: string; size: string };

const sameLine = (a: CartLineKey, b: CartLineKey) => a.lotCode === b.lotCode && a.size === b.size;

const clampQuantity = (quantity: number) => Math.min(maxBagsPerLine, Math.max(1, Math.trunc(quantity)));

export const cartStore = {
  /** The lines now; the same array until the cart changes (for `useSyncExternalStore`). */
  getSnapshot(): readonly CartLine[] {
    const raw = readRaw();
    if (raw !== cachedRaw) {
      cachedRaw = raw;
      cachedLines = parse(raw);
    }
    return cachedLines;
  },

  subscribe(listener: Listener): () => void {
    listeners.add(listener);
    // Another tab changed the cart.
    const onStorage = (event: StorageEvent) => {
      if (event.key === STORAGE_KEY || event.key === null) listener();
    };
    window.addEventListener('storage', onStorage);
    return () => {
      listeners.delete(listener);
      window.removeEventListener('storage', onStorage);
    };
  },

  /**
   * Adds bags; the same lot and size join the line already there (up to the most one line takes).
   * False when the cart already holds as many lines as one order takes.
   */
  add(line: CartLine): boolean {
    const lines = cartStore.getSnapshot();
    const existing = lines.find((each) => sameLine(each, line));
    if (existing) {
      write(lines.map((each) => (each === existing ? { ...line, quantity: clampQuantity(existing.quantity + line.quantity) } : each)));
      return true;
    }
    if (lines.length >= maxLinesPerOrder) return false;
    write([...lines, { ...line, quantity: clampQuantity(line.quantity) }]);
    return true;
  },

  setQuantity(key: CartLineKey, quantity: number): void {
    write(cartStore.getSnapshot().map((each) => (sameLine(each, key) ? { ...each, quantity: clampQuantity(quantity) } : each)));
  },

  remove(key: CartLineKey): void {
    write(cartStore.getSnapshot().filter((each) => !sameLine(each, key)));
  },

  clear(): void {
    write(EMPTY);
  },
};
