import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import type { StoredPostalAddress } from '@shared/schemas/address';
import { subscriptionCheckoutRequestSchema } from '@shared/schemas/subscriptions';
import { AddressFields, addressFieldPaths, addressFormValues } from '@/components/address/address-fields';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { FormAlert } from '@/components/ui/form-alert';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { leaveFor } from '@/lib/leave-for';
import { useCreateSubscriptionCheckout } from '../api/create-subscription-checkout';
import { searchFromBuilder } from '../utils/builder-search';
import type { SubscriptionBuild } from '../utils/subscription-form';

type CheckoutFields = z.input<typeof subscriptionCheckoutRequestSchema>;

type SubscriptionCheckoutFormProps = {
  build: SubscriptionBuild;
  /** The address to start from (the customer's saved default), or blank fields. */
  initialAddress?: StoredPostalAddress;
  /** With nothing in the address book yet, "Save for next time" starts ticked. */
  addressBookEmpty: boolean;
};

/** Where the deliveries ship; submitting creates the subscription and goes on to the payment page. */
export function SubscriptionCheckoutForm({ build, initialAddress, addressBookEmpty }: SubscriptionCheckoutFormProps) {
  const checkout = useCreateSubscriptionCheckout();
  const [formError, setFormError] = useState<string>();
  const [soldOut, setSoldOut] = useState(false);
  const form = useForm<CheckoutFields, unknown, z.output<typeof subscriptionCheckoutRequestSchema>>({
    resolver: zodResolver(subscriptionCheckoutRequestSchema),
    defaultValues: {
      ...build,
      shippingAddress: addressFormValues(initialAddress),
      saveAddress: addressBookEmpty,
    },
  });

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      const { checkoutUrl } = await checkout.mutateAsync(input);
      leaveFor(checkoutUrl);
    } catch (error) {
      setSoldOut(error instanceof ApiError && error.code === 'lot_sold_out');
      setFormError(applyServerErrors(error, form.setError, addressFieldPaths('shippingAddress')));
    }
  });

  const busy = form.formState.isSubmitting || checkout.isSuccess;
  return (
    <FormProvider {...form}>
      <form noValidate aria-label="Shipping address" onSubmit={(event) => void submit(event)} className="grid gap-4">
        {formError ? (
          <FormAlert>
            <span>
              {formError}
              {soldOut ? (
                <>
                  {' '}
                  <Link to={paths.subscribe.getHref(searchFromBuilder({ ...build, lotCode: null }))} className="font-semibold text-leaf underline">
                    Subscribe to the Roaster’s Rotation instead
                  </Link>
                </>
              ) : null}
            </span>
          </FormAlert>
        ) : null}
        <AddressFields at="shippingAddress" />
        <CheckboxField label="Save this address for next time" {...form.register('saveAddress')} />
        <div>
          <Button type="submit" disabled={busy}>
            {busy ? 'Opening the payment page…' : 'Continue to payment'}
          </Button>
          <p className="mt-2 text-small text-ink-muted">
            You pay the first delivery on the next page; later ones are charged as each period starts. Nothing is charged until you confirm there.
          </p>
        </div>
      </form>
    </FormProvider>
  );
}
