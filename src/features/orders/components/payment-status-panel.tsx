import { LoaderCircle } from 'lucide-react';
import { useEffect, useState } from 'react';
import type { OrderDetail } from '@shared/schemas/orders';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';

/** After this long without a confirmation, the page says the wait is unusual (the webhook normally lands in seconds). */
export const PAYMENT_SLOW_MS = 20_000;

type PaymentStatusPanelProps = {
  order: OrderDetail;
  /** Asks the server again at once (the page also keeps asking by itself). */
  onCheckAgain: () => void;
};

function useTakingLong(waiting: boolean): boolean {
  const [takingLong, setTakingLong] = useState(false);
  useEffect(() => {
    if (!waiting) return;
    const timer = setTimeout(() => setTakingLong(true), PAYMENT_SLOW_MS);
    return () => clearTimeout(timer);
  }, [waiting]);
  return waiting && takingLong;
}

/**
 * What the page says on the way back from the payment page. The order counts as paid only once
 * the server has had the payment's webhook; until then it says it is waiting, never "paid".
 */
export function PaymentStatusPanel({ order, onCheckAgain }: PaymentStatusPanelProps) {
  const takingLong = useTakingLong(order.status === 'pending_payment');

  if (order.status === 'pending_payment') {
    return (
      <div role="status" className="flex items-start gap-3 rounded-card border border-rule bg-sheet p-4">
        <LoaderCircle aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-leaf motion-safe:animate-spin" />
        <div>
          <p className="font-semibold">Waiting for the payment to be confirmed…</p>
          {takingLong ? (
            <>
              <p className="text-small">
                This is taking longer than usual: the payment has not been confirmed to us yet. This page keeps checking by itself, and the order-confirmed
                e-mail follows as soon as it is. If you paid, your bags stay held for you; if you left the payment page without paying, nothing has been
                charged.
              </p>
              <Button variant="secondary" className="mt-3" onClick={onCheckAgain}>
                Check again now
              </Button>
            </>
          ) : (
            <p className="text-small text-ink-muted">
              This usually takes a few seconds. Keep this page open; it updates by itself. If you left the payment page without paying, nothing has been
              charged.
            </p>
          )}
        </div>
      </div>
    );
  }
  if (order.status === 'cancelled') {
    return <FormAlert>This order was cancelled before it was paid, and nothing was charged. Its bags are back in stock.</FormAlert>;
  }
  return (
    <FormAlert tone="status">
      <span className="font-semibold">Payment confirmed. Thank you!</span> A confirmation e-mail is on its way.
    </FormAlert>
  );
}
