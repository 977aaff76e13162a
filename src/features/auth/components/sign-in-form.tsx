import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { signInSchema, type User } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignIn } from '../api/sign-in';

type SignInFields = z.input<typeof signInSchema>;

export function SignInForm({ onSignedIn }: { onSignedIn: (user: User) => void }) {
  const form = useForm<SignInFields, unknown, z.output<typeof signInSchema>>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  const [formError, setFormError] = useState<string>();
  const signIn = useSignIn({ onSuccess: onSignedIn });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await signIn.mutateAsync(input);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['email', 'password']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-5">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <TextField
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="email"
        autoCapitalize="none"
        spellCheck={false}
        error={errors.email?.message}
        {...form.register('email')}
      />
      <div>
        <PasswordField label="Password" autoComplete="current-password" error={errors.password?.message} {...form.register('password')} />
        <p className="mt-2 text-small">
          <Link to={paths.forgotPassword.getHref()} className="font-semibold text-leaf underline">
            Forgot your password?
          </Link>
        </p>
      </div>
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
