import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { passwordChangeSchema } from '@shared/schemas/account';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';
import { NewPasswordHint } from './new-password-hint';

type PasswordChangeFields = z.input<typeof passwordChangeSchema>;

export function PasswordChangeForm() {
  const form = useForm<PasswordChangeFields, unknown, z.output<typeof passwordChangeSchema>>({
    resolver: zodResolver(passwordChangeSchema),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const [outcome, setOutcome] = useState<{ tone: 'alert' | 'status'; message: string }>();
  const changePassword = useChangePassword();
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setOutcome(undefined);
    try {
      await changePassword.mutateAsync(input);
      form.reset();
      setOutcome({ tone: 'status', message: 'Your password is changed. Every other browser signed in to this account is now signed out.' });
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ['currentPassword', 'newPassword']);
      setOutcome(message ? { tone: 'alert', message } : undefined);
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4">
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.message}</FormAlert> : null}
      <PasswordField label="Current password" autoComplete="current-password" error={errors.currentPassword?.message} {...form.register('currentPassword')} />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        hint={<NewPasswordHint />}
        error={errors.newPassword?.message}
        {...form.register('newPassword')}
      />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Change password'}
        </Button>
      </div>
    </form>
  );
}
