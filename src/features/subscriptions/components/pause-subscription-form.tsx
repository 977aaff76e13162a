import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { subscriptionPauseSchema, type PaidDeliveryChoice, type Subscription, type SubscriptionPause } from '@shared/schemas/subscriptions';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { usePauseSubscription } from '../api/pause-subscription';
import { describeChangeError } from '../utils/change-errors';

type PauseSubscriptionFormProps = {
  subscription: Subscription;
  onDone: (message: string) => void;
  onCancel: () => void;
};

const paidDeliveryOptions = [
  { value: 'ship', label: 'Ship it as planned', detail: 'It roasts and ships on its day; the pause starts after it.' },
  { value: 'hold', label: 'Hold it for after the pause', detail: 'Your payment moves to the first delivery after the pause.' },
] as const;

/**
 * No delivery roasts before the chosen day; the first one on or after it goes ahead. When a delivery
 * already paid for lies inside the pause, the server asks first (409 `paid_delivery_in_pause`), and
 * the form asks the subscriber the same question: ship it, or hold it.
 */
export function PauseSubscriptionForm({ subscription, onDone, onCancel }: PauseSubscriptionFormProps) {
  const pause = usePauseSubscription();
  const [formError, setFormError] = useState<string>();
  const [paidQuestion, setPaidQuestion] = useState<string>();
  const [paidDelivery, setPaidDelivery] = useState<PaidDeliveryChoice>();
  const [paidError, setPaidError] = useState<string>();
  const form = useForm<SubscriptionPause>({ resolver: zodResolver(subscriptionPauseSchema), defaultValues: { until: '' } });

  const submit = form.handleSubmit(async ({ until }) => {
    setFormError(undefined);
    setPaidError(undefined);
    if (paidQuestion && !paidDelivery) {
      setPaidError('Choose whether to ship the paid delivery or hold it.');
      return;
    }
    try {
      const changed = await pause.mutateAsync({ id: subscription.id, until, ...(paidQuestion && paidDelivery ? { paidDelivery } : {}) });
      onDone(changed.notice);
    } catch (error) {
      if (error instanceof ApiError && error.code === 'paid_delivery_in_pause') {
        setPaidQuestion(error.message);
        return;
      }
      const rest = applyServerErrors(error, form.setError, ['until']);
      if (rest !== undefined) setFormError(describeChangeError(error));
    }
  });

  return (
    <form noValidate aria-label="Pause deliveries" onSubmit={(event) => void submit(event)} className="grid max-w-xl gap-4">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <TextField
        label="Pause until"
        type="date"
        hint="Deliveries start again with the first roast day on or after this date."
        error={form.formState.errors.until?.message}
        {...form.register('until', { onChange: () => setPaidQuestion(undefined) })}
      />
      {paidQuestion ? (
        <ChoiceGroup
          legend="A paid delivery falls inside the pause"
          hint={paidQuestion}
          name={`paid-delivery-${subscription.id}`}
          choices={paidDeliveryOptions}
          value={paidDelivery}
          onChange={setPaidDelivery}
          error={paidError}
          columns={2}
        />
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Pausing…' : 'Pause deliveries'}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Keep them coming
        </Button>
      </div>
    </form>
  );
}
