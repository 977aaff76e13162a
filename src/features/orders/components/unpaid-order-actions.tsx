import type { OrderDetail } from '@shared/schemas/orders';
import { AwaitingPaymentActions } from '@/components/checkout/awaiting-payment-actions';
import { useDiscardOrder } from '../api/discard-order';
import { usePayOrder } from '../api/pay-order';

/** "Pay now" or "Discard" on a green order left awaiting payment; nothing for any other order. */
export function UnpaidOrderActions({ order, onDiscarded }: { order: OrderDetail; onDiscarded: () => void }) {
  const pay = usePayOrder();
  const discard = useDiscardOrder();
  if (order.kind !== 'green' || order.status !== 'pending_payment') return null;
  return (
    <AwaitingPaymentActions
      what="order"
      discardConsequence="The order is cancelled and its bags go back on sale. Nothing is charged, and it leaves your order history."
      onPay={() => pay.mutateAsync(order.id)}
      onDiscard={async () => {
        await discard.mutateAsync(order.id);
        onDiscarded();
      }}
    />
  );
}
