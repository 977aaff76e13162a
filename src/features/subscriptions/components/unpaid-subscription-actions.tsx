import type { Subscription } from '@shared/schemas/subscriptions';
import { AwaitingPaymentActions } from '@/components/checkout/awaiting-payment-actions';
import { useDiscardSubscription } from '../api/discard-subscription';
import { usePaySubscription } from '../api/pay-subscription';

/** "Pay now" or "Discard" on a subscription whose first payment never came; nothing once it has started. */
export function UnpaidSubscriptionActions({ subscription, onDiscarded }: { subscription: Subscription; onDiscarded?: () => void }) {
  const pay = usePaySubscription();
  const discard = useDiscardSubscription();
  if (subscription.status !== 'incomplete') return null;
  return (
    <AwaitingPaymentActions
      what="subscription"
      discardConsequence="The subscription is cancelled before it starts. Nothing is charged, and it leaves your subscriptions."
      onPay={() => pay.mutateAsync(subscription.id)}
      onDiscard={async () => {
        await discard.mutateAsync(subscription.id);
        onDiscarded?.();
      }}
    />
  );
}
