import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { greenCheckoutRequestSchema, type ShippingAddress } from '@shared/schemas/checkout';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { leaveFor } from '@/lib/leave-for';
import { useCreateGreenCheckout } from '../api/create-green-checkout';
import { useCart } from '../hooks/use-cart';
import { toCheckoutItems } from '../utils/quote-cart';

type CheckoutFields = z.input<typeof greenCheckoutRequestSchema>;

const fieldNames = [
  'shippingAddress.name',
  'shippingAddress.line1',
  'shippingAddress.line2',
  'shippingAddress.city',
  'shippingAddress.region',
  'shippingAddress.postalCode',
  'shippingAddress.country',
] as const;

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
  initialAddress?: ShippingAddress;
  /** Shows the server's reasons against the cart lines they concern. */
  onLineErrors: (errors: Record<number, string>) => void;
};

/** Where the order ships; submitting places it and goes on to the payment page. */
export function CheckoutForm({ initialAddress, onLineErrors }: CheckoutFormProps) {
  const { lines } = useCart();
  const checkout = useCreateGreenCheckout();
  const [formError, setFormError] = useState<string>();
  // One key per cart and address: submitting the same again (after a lost answer or a 503) resumes that order.
  const [attempt, setAttempt] = useState<{ sent: string; checkoutKey: string }>();
  const form = useForm<CheckoutFields, unknown, z.output<typeof greenCheckoutRequestSchema>>({
    resolver: zodResolver(greenCheckoutRequestSchema),
    defaultValues: {
      items: toCheckoutItems(lines),
      shippingAddress: initialAddress
        ? { ...initialAddress, line2: initialAddress.line2 ?? '' }
        : { name: '', line1: '', line2: '', city: '', region: '', postalCode: '', country: 'US' },
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

  const address = errors.shippingAddress;
  const busy = form.formState.isSubmitting || checkout.isSuccess;

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4" aria-label="Shipping address">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      {errors.items?.message ? <FormAlert>{errors.items.message}</FormAlert> : null}
      <TextField label="Recipient’s name" autoComplete="shipping name" error={address?.name?.message} {...form.register('shippingAddress.name')} />
      <TextField
        label="Street address"
        autoComplete="shipping address-line1"
        error={address?.line1?.message}
        {...form.register('shippingAddress.line1')}
      />
      <TextField
        label="Apartment, suite or unit (optional)"
        autoComplete="shipping address-line2"
        error={address?.line2?.message}
        {...form.register('shippingAddress.line2')}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="City or town"
          autoComplete="shipping address-level2"
          error={address?.city?.message}
          {...form.register('shippingAddress.city')}
        />
        <TextField
          label="State or region"
          autoComplete="shipping address-level1"
          error={address?.region?.message}
          {...form.register('shippingAddress.region')}
        />
        <TextField
          label="ZIP or postal code"
          autoComplete="shipping postal-code"
          error={address?.postalCode?.message}
          {...form.register('shippingAddress.postalCode')}
        />
        <TextField
          label="Country code"
          autoComplete="shipping country"
          autoCapitalize="characters"
          maxLength={2}
          hint="Two letters, like US."
          error={address?.country?.message}
          {...form.register('shippingAddress.country')}
        />
      </div>
      <div>
        <Button type="submit" disabled={busy || lines.length === 0}>
          {busy ? 'Opening the payment page…' : 'Continue to payment'}
        </Button>
        <p className="mt-2 text-small text-ink-muted">You pay on the next page. Your bags are held for you while you do.</p>
      </div>
    </form>
  );
}
