import { LoaderCircle } from 'lucide-react';
import type { Subscription } from '@shared/schemas/subscriptions';
import { FormAlert } from '@/components/ui/form-alert';

/**
 * What the page says on the way back from the payment page. The subscription counts as started
 * only once the server has had the payment's webhook; until then it says it is waiting.
 */
export function ActivationStatusPanel({ subscription }: { subscription: Subscription }) {
  if (subscription.status === 'incomplete') {
    return (
      <div role="status" className="flex items-start gap-3 rounded-card border border-rule bg-sheet p-4">
        <LoaderCircle aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-leaf motion-safe:animate-spin" />
        <div>
          <p className="font-semibold">Waiting for the payment to be confirmed…</p>
          <p className="text-small text-ink-muted">
            This usually takes a few seconds. Keep this page open; it updates by itself. If you left the payment page without paying, nothing has been charged.
          </p>
        </div>
      </div>
    );
  }
  if (subscription.status === 'cancelled') {
    return <FormAlert>This subscription was cancelled before it started.</FormAlert>;
  }
  return (
    <FormAlert tone="status">
      <span className="font-semibold">Your subscription has started. Thank you!</span> A confirmation e-mail is on its way; your deliveries are below.
    </FormAlert>
  );
}
