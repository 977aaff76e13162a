import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormAlert } from '@/components/ui/form-alert';

type AwaitingPaymentActionsProps = {
  /** What is waiting, as the sentences say it: "order", "subscription". */
  what: string;
  /** What discarding gives up, said in the confirmation. */
  discardConsequence: string;
  /** Goes on to the payment page (leaves the app on success). */
  onPay: () => Promise<unknown>;
  onDiscard: () => Promise<unknown>;
};

/** "Pay now" or "Discard" for a checkout left before paying; discarding asks first. */
export function AwaitingPaymentActions({ what, discardConsequence, onPay, onDiscard }: AwaitingPaymentActionsProps) {
  const [busy, setBusy] = useState<'pay' | 'discard'>();
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string>();

  async function run(action: 'pay' | 'discard', call: () => Promise<unknown>) {
    setBusy(action);
    setError(undefined);
    try {
      await call();
      if (action === 'discard') setConfirming(false);
    } catch (failure) {
      setError(failure instanceof Error ? failure.message : 'That did not work. Please try again.');
      setBusy(undefined);
      setConfirming(false);
    }
  }

  return (
    <section aria-label={`Unpaid ${what}`} className="grid gap-3 rounded-card border border-rule bg-sheet p-4">
      <p>This {what} is waiting for payment. Nothing has been charged. Pay now to go on, or discard it.</p>
      {error ? <FormAlert>{error}</FormAlert> : null}
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => void run('pay', onPay)} disabled={busy !== undefined}>
          {busy === 'pay' ? 'Opening the payment page…' : 'Pay now'}
        </Button>
        <Button variant="secondary" onClick={() => setConfirming(true)} disabled={busy !== undefined}>
          Discard
        </Button>
      </div>
      <ConfirmDialog
        open={confirming}
        title={`Discard this ${what}?`}
        confirmLabel={busy === 'discard' ? 'Discarding…' : `Discard the ${what}`}
        cancelLabel={`Keep the ${what}`}
        busy={busy === 'discard'}
        onConfirm={() => void run('discard', onDiscard)}
        onCancel={() => setConfirming(false)}
      >
        {discardConsequence}
      </ConfirmDialog>
    </section>
  );
}
