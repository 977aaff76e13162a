import { useFormContext } from 'react-hook-form';
import type { z } from 'zod';
import type { shippingAddressSchema } from '@shared/schemas/checkout';
import { TextField } from '@/components/ui/text-field';

type AddressForm = { shippingAddress: z.input<typeof shippingAddressSchema> };

export const shippingAddressFieldNames = [
  'shippingAddress.name',
  'shippingAddress.line1',
  'shippingAddress.line2',
  'shippingAddress.city',
  'shippingAddress.region',
  'shippingAddress.postalCode',
  'shippingAddress.country',
] as const;

export const blankShippingAddress: AddressForm['shippingAddress'] = {
  name: '',
  line1: '',
  line2: '',
  city: '',
  region: '',
  postalCode: '',
  country: 'US',
};

/** The shipping address fields of a form that holds `shippingAddress`, with the browser's autofill names. */
export function ShippingAddressFields() {
  const { register, formState } = useFormContext<AddressForm>();
  const address = formState.errors.shippingAddress;
  return (
    <div className="grid gap-4">
      <TextField label="Recipient’s name" autoComplete="shipping name" error={address?.name?.message} {...register('shippingAddress.name')} />
      <TextField label="Street address" autoComplete="shipping address-line1" error={address?.line1?.message} {...register('shippingAddress.line1')} />
      <TextField
        label="Apartment, suite or unit (optional)"
        autoComplete="shipping address-line2"
        error={address?.line2?.message}
        {...register('shippingAddress.line2')}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="City or town" autoComplete="shipping address-level2" error={address?.city?.message} {...register('shippingAddress.city')} />
        <TextField
          label="State or region"
          autoComplete="shipping address-level1"
          error={address?.region?.message}
          {...register('shippingAddress.region')}
        />
        <TextField
          label="ZIP or postal code"
          autoComplete="shipping postal-code"
          error={address?.postalCode?.message}
          {...register('shippingAddress.postalCode')}
        />
        <TextField
          label="Country code"
          autoComplete="shipping country"
          autoCapitalize="characters"
          maxLength={2}
          hint="Two letters, like US."
          error={address?.country?.message}
          {...register('shippingAddress.country')}
        />
      </div>
    </div>
  );
}
