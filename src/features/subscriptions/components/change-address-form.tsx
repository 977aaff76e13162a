import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import { z } from 'zod';
import { shippingAddressSchema } from '@shared/schemas/checkout';
import type { Subscription } from '@shared/schemas/subscriptions';
import { AddressFields, addressFieldPaths, addressFormValues } from '@/components/address/address-fields';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateSubscription } from '../api/update-subscription';
import { describeChangeError } from '../utils/change-errors';

const addressChangeSchema = z.object({ shippingAddress: shippingAddressSchema });

type ChangeAddressFormProps = {
  subscription: Subscription;
  onDone: (message: string) => void;
  onCancel: () => void;
};

/** Where the deliveries ship, from the next one whose cutoff has not passed. */
export function ChangeAddressForm({ subscription, onDone, onCancel }: ChangeAddressFormProps) {
  const update = useUpdateSubscription();
  const [formError, setFormError] = useState<string>();
  const form = useForm<z.input<typeof addressChangeSchema>, unknown, z.output<typeof addressChangeSchema>>({
    resolver: zodResolver(addressChangeSchema),
    defaultValues: { shippingAddress: addressFormValues(subscription.shippingAddress) },
  });

  const submit = form.handleSubmit(async ({ shippingAddress }) => {
    setFormError(undefined);
    try {
      await update.mutateAsync({ id: subscription.id, update: { shippingAddress } });
      onDone('The new address is saved for the next delivery whose cutoff has not passed.');
    } catch (error) {
      const rest = applyServerErrors(error, form.setError, addressFieldPaths('shippingAddress'));
      if (rest !== undefined) setFormError(describeChangeError(error));
    }
  });

  return (
    <FormProvider {...form}>
      <form noValidate aria-label="Change the shipping address" onSubmit={(event) => void submit(event)} className="grid max-w-xl gap-4">
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        <AddressFields at="shippingAddress" />
        <div className="flex flex-wrap gap-3">
          <Button type="submit" disabled={form.formState.isSubmitting}>
            {form.formState.isSubmitting ? 'Saving…' : 'Save the address'}
          </Button>
          <Button variant="secondary" onClick={onCancel}>
            Close without changing
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
