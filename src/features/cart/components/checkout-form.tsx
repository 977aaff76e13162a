import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';
import type { StoredPostalAddress } from '@shared/schemas/address';
import { greenCheckoutRequestSchema } from '@shared/schemas/checkout';
import { AddressFields, addressFieldPaths, addressFormValues } from '@/components/address/address-fields';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { FormAlert } from '@/components/ui/form-alert';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { leaveFor } from '@/lib/leave-for';
import { useCreateGreenCheckout } from '../api/create-green-checkout';
import { useCart } from '../hooks/use-cart';
import { toCheckoutItems } from '../utils/quote-cart';

type CheckoutFields = z.input<typeof greenCheckoutRequestSchema>;

const fieldNames = addressFieldPaths('shippingAddress');

const ITEM_FIELD = /^items\.(\d+)(?:\.|$)/;

/** The server's reasons about single cart lines (`items.<index>.<field>`), by line index. */
function lineErrorsOf(error: unknown): Record<number, string> {
  if (!(error instanceof ApiError)) return {};
  const found: Record<number, string> = {};
  for (const [path, reason] of Object.entries(error.fields ?? {})) {
    const match = ITEM_FIELD.exec(path);
    if (match) found[Number(match[1])] = reason;
  }
  return found;
}

type CheckoutFormProps = {
  /** The address to start from (the customer's saved default), or blank fields. */
  initialAddress?: StoredPostalAddress;
  /** With nothing in the address book yet, "Save for next time" starts ticked. */
  addressBookEmpty: boolean;
  /** Shows the server's reasons against the cart lines they concern. */
  onLineErrors: (errors: Record<number, string>) => void;
};

/** Where the order ships; submitting places it and goes on to the payment page. */
export function CheckoutForm({ initialAddress, addressBookEmpty, onLineErrors }: CheckoutFormProps) {
  const { lines } = useCart();
  const checkout = useCreateGreenCheckout();
  const [formError, setFormError] = useState<string>();
  // One key per cart and address: submitting the same again (after a lost answer or a 503) resumes that order.
  const [attempt, setAttempt] = useState<{ sent: string; checkoutKey: string }>();
  const form = useForm<CheckoutFields, unknown, z.output<typeof greenCheckoutRequestSchema>>({
    resolver: zodResolver(greenCheckoutRequestSchema),
    defaultValues: {
      items: toCheckoutItems(lines),
      shippingAddress: addressFormValues(initialAddress),
      saveAddress: addressBookEmpty,
    },
  });
  const { errors } = form.formState;
  const { setValue } = form;

  // The cart can change in another tab; the order is always what the cart holds now.
  useEffect(() => setValue('items', toCheckoutItems(lines)), [lines, setValue]);

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    onLineErrors({});
    try {
      const sent = JSON.stringify(input);
      const current = attempt?.sent === sent ? attempt : { sent, checkoutKey: crypto.randomUUID() };
      setAttempt(current);
      const { checkoutUrl } = await checkout.mutateAsync({ input, checkoutKey: current.checkoutKey });
      leaveFor(checkoutUrl);
    } catch (error) {
      onLineErrors(lineErrorsOf(error));
      setFormError(applyServerErrors(error, form.setError, fieldNames));
    }
  });

  const busy = form.formState.isSubmitting || checkout.isSuccess;

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4" aria-label="Shipping address">
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        {errors.items?.message ? <FormAlert>{errors.items.message}</FormAlert> : null}
        <AddressFields at="shippingAddress" />
        <CheckboxField label="Save this address for next time" {...form.register('saveAddress')} />
        <div>
          <Button type="submit" disabled={busy || lines.length === 0}>
            {busy ? 'Opening the payment page…' : 'Continue to payment'}
          </Button>
          <p className="mt-2 text-small text-ink-muted">You pay on the next page. Your bags are held for you while you do.</p>
        </div>
      </form>
    </FormProvider>
  );
}
