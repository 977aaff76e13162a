import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { addressInputSchema, type Address, type AddressInput } from '@shared/schemas/account';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';

type AddressFields = z.input<typeof addressInputSchema>;

const fieldNames = ['name', 'line1', 'line2', 'city', 'region', 'postalCode', 'country', 'isDefault'] as const;

function toFields(address: Address | undefined): AddressFields {
  if (!address) return { name: '', line1: '', line2: '', city: '', region: '', postalCode: '', country: 'US', isDefault: false };
  const { id: _id, ...fields } = address;
  return { ...fields, line2: fields.line2 ?? '' };
}

type AddressFormProps = {
  /** The address to edit; none to add a new one. */
  address?: Address;
  submitLabel: string;
  onSubmit: (input: AddressInput) => Promise<unknown>;
  onCancel: () => void;
};

/** A shipping address, with the autofill tokens browsers use for shipping forms. */
export function AddressForm({ address, submitLabel, onSubmit, onCancel }: AddressFormProps) {
  const form = useForm<AddressFields, unknown, z.output<typeof addressInputSchema>>({
    resolver: zodResolver(addressInputSchema),
    defaultValues: toFields(address),
  });
  const [formError, setFormError] = useState<string>();
  const { errors } = form.formState;
  const { setFocus } = form;

  // The form opens on request: take the person straight to its first field.
  useEffect(() => setFocus('name'), [setFocus]);

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await onSubmit(input);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fieldNames));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <TextField label="Recipient’s name" autoComplete="shipping name" error={errors.name?.message} {...form.register('name')} />
      <TextField label="Street address" autoComplete="shipping address-line1" error={errors.line1?.message} {...form.register('line1')} />
      <TextField
        label="Apartment, suite or unit (optional)"
        autoComplete="shipping address-line2"
        error={errors.line2?.message}
        {...form.register('line2')}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="City or town" autoComplete="shipping address-level2" error={errors.city?.message} {...form.register('city')} />
        <TextField label="State or region" autoComplete="shipping address-level1" error={errors.region?.message} {...form.register('region')} />
        <TextField
          label="ZIP or postal code"
          autoComplete="shipping postal-code"
          error={errors.postalCode?.message}
          {...form.register('postalCode')}
        />
        <TextField
          label="Country code"
          autoComplete="shipping country"
          autoCapitalize="characters"
          maxLength={2}
          hint="Two letters, like US."
          error={errors.country?.message}
          {...form.register('country')}
        />
      </div>
      <CheckboxField label="Use this address first at checkout" {...form.register('isDefault')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : submitLabel}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
