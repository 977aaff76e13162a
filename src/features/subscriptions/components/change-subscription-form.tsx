import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { Subscription, SubscriptionUpdate } from '@shared/schemas/subscriptions';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateSubscription } from '../api/update-subscription';
import { describeChangeError } from '../utils/change-errors';
import { subscriptionChoiceKeys, subscriptionChoiceSchema, type SubscriptionChoice, type SubscriptionChoiceFields } from '../utils/subscription-form';
import { SubscriptionChoiceFieldset } from './subscription-choice-fields';

type ChangeSubscriptionFormProps = {
  subscription: Subscription;
  allowedLevels: readonly RoastLevel[];
  onDone: (message: string) => void;
  onCancel: () => void;
};

/** Only what differs from the subscription as it is. */
function changesFrom(subscription: Subscription, chosen: SubscriptionChoice): SubscriptionUpdate {
  const update: Record<string, unknown> = {};
  for (const key of subscriptionChoiceKeys) if (chosen[key] !== subscription[key]) update[key] = chosen[key];
  return update as SubscriptionUpdate;
}

/** Level, size, bags, grind, brew method and cadence, from the next delivery whose cutoff has not passed. */
export function ChangeSubscriptionForm({ subscription, allowedLevels, onDone, onCancel }: ChangeSubscriptionFormProps) {
  const update = useUpdateSubscription();
  const [formError, setFormError] = useState<string>();
  const form = useForm<SubscriptionChoiceFields, unknown, SubscriptionChoice>({
    resolver: zodResolver(subscriptionChoiceSchema),
    defaultValues: {
      roastLevel: subscription.roastLevel,
      bagSize: subscription.bagSize,
      bagsPerDelivery: subscription.bagsPerDelivery,
      grind: subscription.grind,
      brewMethod: subscription.brewMethod,
      cadenceWeeks: subscription.cadenceWeeks,
    },
  });

  const submit = form.handleSubmit(async (chosen) => {
    setFormError(undefined);
    const changes = changesFrom(subscription, chosen);
    if (Object.keys(changes).length === 0) {
      setFormError('Nothing is different yet: change a choice, or close this form.');
      return;
    }
    try {
      await update.mutateAsync({ id: subscription.id, update: changes });
      onDone('Your subscription is changed. The schedule below shows the deliveries it reaches.');
    } catch (error) {
      const rest = applyServerErrors(error, form.setError, subscriptionChoiceKeys);
      if (rest !== undefined) setFormError(describeChangeError(error));
    }
  });

  return (
    <FormProvider {...form}>
      <form noValidate aria-label="Change what each delivery brings" onSubmit={(event) => void submit(event)} className="grid gap-6">
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        <SubscriptionChoiceFieldset allowedLevels={allowedLevels} idPrefix={`change-${subscription.id}`} />
        <p className="text-small text-ink-muted">A delivery already past its cutoff roasts as it is; the change reaches the next one.</p>
        <div className="flex flex-wrap gap-3">
          <Button type="submit" disabled={form.formState.isSubmitting}>
            {form.formState.isSubmitting ? 'Saving…' : 'Save the changes'}
          </Button>
          <Button variant="secondary" onClick={onCancel}>
            Close without changing
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
