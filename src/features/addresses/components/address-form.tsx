import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';
import { addressInputSchema, type Address, type AddressInput } from '@shared/schemas/account';
import { AddressFields, addressFieldPaths, addressFormValues } from '@/components/address/address-fields';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/lib/form-errors';

type AddressFormFields = z.input<typeof addressInputSchema>;

const fieldNames = [...addressFieldPaths(), 'isDefault'] as const;

type AddressFormProps = {
  /** The address to edit; none to add a new one. */
  address?: Address;
  submitLabel: string;
  onSubmit: (input: AddressInput) => Promise<unknown>;
  onCancel: () => void;
};

/** A shipping address, with the autofill tokens browsers use for shipping forms. */
export function AddressForm({ address, submitLabel, onSubmit, onCancel }: AddressFormProps) {
  const form = useForm<AddressFormFields, unknown, z.output<typeof addressInputSchema>>({
    resolver: zodResolver(addressInputSchema),
    defaultValues: { ...addressFormValues(address), isDefault: address?.isDefault ?? false },
  });
  const [formError, setFormError] = useState<string>();
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
    <FormProvider {...form}>
      <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4">
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        <AddressFields />
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
    </FormProvider>
  );
}
