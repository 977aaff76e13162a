import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { subscriptionPauseSchema, type Subscription, type SubscriptionPause } from '@shared/schemas/subscriptions';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { usePauseSubscription } from '../api/pause-subscription';
import { describeChangeError } from '../utils/change-errors';
import { formatDeliveryDay } from '@/lib/subscription-labels';

type PauseSubscriptionFormProps = {
  subscription: Subscription;
  onDone: (message: string) => void;
  onCancel: () => void;
};

/** No delivery roasts before the chosen day; the first one on or after it goes ahead. */
export function PauseSubscriptionForm({ subscription, onDone, onCancel }: PauseSubscriptionFormProps) {
  const pause = usePauseSubscription();
  const [formError, setFormError] = useState<string>();
  const form = useForm<SubscriptionPause>({ resolver: zodResolver(subscriptionPauseSchema), defaultValues: { until: '' } });

  const submit = form.handleSubmit(async ({ until }) => {
    setFormError(undefined);
    try {
      await pause.mutateAsync({ id: subscription.id, until });
      onDone(`Paused: no delivery roasts before ${formatDeliveryDay(until)}. Resume any time before then.`);
    } catch (error) {
      const rest = applyServerErrors(error, form.setError, ['until']);
      if (rest !== undefined) setFormError(describeChangeError(error));
    }
  });

  return (
    <form noValidate aria-label="Pause deliveries" onSubmit={(event) => void submit(event)} className="grid max-w-md gap-4">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <TextField
        label="Pause until"
        type="date"
        hint="Deliveries start again with the first roast day on or after this date."
        error={form.formState.errors.until?.message}
        {...form.register('until')}
      />
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
