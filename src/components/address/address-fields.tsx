import { useFormContext, type FieldValues } from 'react-hook-form';
import type { z } from 'zod';
import { postalAddressFields, type PostalAddressField, type postalAddressInputSchema, type StoredPostalAddress } from '@shared/schemas/address';
import { TextField } from '@/components/ui/text-field';

type AddressFormValues = z.input<typeof postalAddressInputSchema>;

/** The form values of an address to start from (a saved one, or blank fields shipping to the US). */
export function addressFormValues(address?: StoredPostalAddress): AddressFormValues {
  if (!address) return { name: '', line1: '', line2: '', city: '', region: '', postalCode: '', country: 'US' };
  const { name, line1, line2, city, region, postalCode, country } = address;
  return { name, line1, line2: line2 ?? '', city, region, postalCode, country };
}

/** The field paths of an address held at `at` in a form (the whole form when `at` is left out). */
export function addressFieldPaths<const At extends string>(at: At): `${At}.${PostalAddressField}`[];
export function addressFieldPaths(): PostalAddressField[];
export function addressFieldPaths(at?: string): string[] {
  return postalAddressFields.map((field) => (at ? `${at}.${field}` : field));
}

type AddressFieldsProps = {
  /** Where the address sits in the surrounding form, like `shippingAddress`; left out, the form is the address. */
  at?: string;
};

/**
 * The fields of a postal address with the autofill tokens browsers use for shipping forms. Lives
 * inside a react-hook-form `FormProvider`.
 */
export function AddressFields({ at }: AddressFieldsProps) {
  const { register, getFieldState, formState } = useFormContext<FieldValues>();
  const field = (name: PostalAddressField) => {
    const path = at ? `${at}.${name}` : name;
    return { ...register(path), error: getFieldState(path, formState).error?.message };
  };
  return (
    <div className="grid gap-4">
      <TextField label="Recipient’s name" autoComplete="shipping name" {...field('name')} />
      <TextField label="Street address" autoComplete="shipping address-line1" {...field('line1')} />
      <TextField label="Apartment, suite or unit (optional)" autoComplete="shipping address-line2" {...field('line2')} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="City or town" autoComplete="shipping address-level2" {...field('city')} />
        <TextField label="State or region" autoComplete="shipping address-level1" {...field('region')} />
        <TextField label="ZIP or postal code" autoComplete="shipping postal-code" {...field('postalCode')} />
        <TextField
          label="Country code"
          autoComplete="shipping country"
          autoCapitalize="characters"
          maxLength={2}
          hint="Two letters, like US."
          {...field('country')}
        />
      </div>
    </div>
  );
}
