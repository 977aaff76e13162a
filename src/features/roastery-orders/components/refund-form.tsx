import { useState } from 'react';
import { formatMoney, isCurrencyCode, toMinorUnits } from '@shared/domain/money';
import type { OrderDetail } from '@shared/schemas/orders';
import { refundReasons, type RefundReason } from '@shared/schemas/packing';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useRefundOrder } from '../api/refund-order';

const reasonLabels: Record<RefundReason, string> = {
  requested_by_customer: 'The customer asked',
  duplicate: 'Charged twice',
  fraudulent: 'Not the card holder',
};

/** Orders with money taken that is not all given back yet. */
export function refundableCents(order: OrderDetail): number {
  return order.paidAt === null ? 0 : order.totalCents - order.refundedCents;
}

/** The owner's refund: in full, or part of what is left; asks once before the money moves. */
export function RefundForm({ order }: { order: OrderDetail }) {
  const refund = useRefundOrder();
  const left = refundableCents(order);
  const [scope, setScope] = useState<'full' | 'part'>('full');
  const [amountText, setAmountText] = useState('');
  const [reason, setReason] = useState<RefundReason>('requested_by_customer');
  const [amountError, setAmountError] = useState<string>();
  const [confirming, setConfirming] = useState<number>();
  const [outcome, setOutcome] = useState<{ tone: 'status' | 'alert'; text: string }>();
  // One key per refund meant: a retry after a lost answer is the same refund, never a second one.
  const [refundKey, setRefundKey] = useState(() => crypto.randomUUID());
  const money = (cents: number) => formatMoney(cents, order.currency);

  function review() {
    setOutcome(undefined);
    if (scope === 'full') return setConfirming(left);
    const parsed = toMinorUnits(amountText, isCurrencyCode(order.currency) ? order.currency : 'usd');
    if (!parsed.ok) return setAmountError(parsed.message);
    if (parsed.value <= 0 || parsed.value > left) return setAmountError(`Enter an amount above zero and at most ${money(left)}.`);
    setAmountError(undefined);
    setConfirming(parsed.value);
  }

  async function send(amountCents: number) {
    try {
      await refund.mutateAsync({ id: order.id, refundKey, body: { ...(amountCents === left ? {} : { amountCents }), reason } });
      setOutcome({ tone: 'status', text: `Refund of ${money(amountCents)} sent. The order shows it once the payment provider confirms it.` });
      setRefundKey(crypto.randomUUID());
      setAmountText('');
    } catch (error) {
      setOutcome({ tone: 'alert', text: error instanceof Error ? error.message : 'The refund did not go through.' });
    } finally {
      setConfirming(undefined);
    }
  }

  if (left <= 0) return <p className="text-ink-muted">Nothing is left to refund on this order.</p>;
  return (
    <form
      aria-label="Refund"
      noValidate
      className="grid gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        review();
      }}
    >
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert> : null}
      <ChoiceGroup
        legend="How much"
        name="refund-scope"
        value={scope}
        onChange={setScope}
        columns={2}
        choices={[
          { value: 'full' as const, label: `In full: ${money(left)}` },
          { value: 'part' as const, label: 'Part of it' },
        ]}
      />
      {scope === 'part' ? (
        <TextField
          label={`Amount to refund (${order.currency.toUpperCase()})`}
          inputMode="decimal"
          value={amountText}
          onChange={(event) => setAmountText(event.target.value)}
          error={amountError}
          hint={`At most ${money(left)}.`}
        />
      ) : null}
      <SelectField label="Reason" value={reason} onChange={(event) => setReason(event.target.value as RefundReason)}>
        {refundReasons.map((each) => (
          <option key={each} value={each}>
            {reasonLabels[each]}
          </option>
        ))}
      </SelectField>
      <div>
        <Button type="submit" disabled={refund.isPending}>
          Review the refund
        </Button>
      </div>
      <ConfirmDialog
        open={confirming !== undefined}
        title={`Refund ${money(confirming ?? 0)}?`}
        confirmLabel={refund.isPending ? 'Refunding…' : `Refund ${money(confirming ?? 0)}`}
        cancelLabel="Do not refund"
        busy={refund.isPending}
        onConfirm={() => void send(confirming!)}
        onCancel={() => setConfirming(undefined)}
      >
        {`${money(confirming ?? 0)} goes back to ${order.customer.name}’s card. This cannot be undone.`}
      </ConfirmDialog>
    </form>
  );
}
