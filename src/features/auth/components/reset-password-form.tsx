import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { passwordResetConfirmSchema } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useResetPassword } from '../api/reset-password';
import { NewPasswordHint } from './new-password-hint';

type ResetPasswordFields = z.input<typeof passwordResetConfirmSchema>;

/** Chooses a new password with the token from the e-mailed link. */
export function ResetPasswordForm({ token, onReset }: { token: string; onReset: () => void }) {
  const form = useForm<ResetPasswordFields, unknown, z.output<typeof passwordResetConfirmSchema>>({
    resolver: zodResolver(passwordResetConfirmSchema),
    defaultValues: { token, password: '' },
  });
  const [formError, setFormError] = useState<string>();
  const resetPassword = useResetPassword({ onSuccess: onReset });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await resetPassword.mutateAsync(input);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['password']));
    }
  });

  // The token is not a field anyone types: a problem with it is a problem with the link.
  const linkProblem = formError ?? errors.token?.message;

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-5">
      {linkProblem ? (
        <FormAlert>
          <p>{linkProblem}</p>
          <p className="mt-1">
            <Link to={paths.forgotPassword.getHref()} className="font-semibold text-leaf underline">
              Ask for a new link
            </Link>
          </p>
        </FormAlert>
      ) : null}
      <PasswordField
        label="New password"
        autoComplete="new-password"
        hint={<NewPasswordHint />}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Saving…' : 'Save the new password'}
      </Button>
    </form>
  );
}
