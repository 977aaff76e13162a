import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signUpSchema, type User } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignUp } from '../api/sign-up';
import { NewPasswordHint } from './new-password-hint';

type SignUpFields = z.input<typeof signUpSchema>;

export function SignUpForm({ onSignedUp }: { onSignedUp: (user: User) => void }) {
  const form = useForm<SignUpFields, unknown, z.output<typeof signUpSchema>>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '' },
  });
  const [formError, setFormError] = useState<string>();
  const signUp = useSignUp({ onSuccess: onSignedUp });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await signUp.mutateAsync(input);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['name', 'email', 'password']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-5">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <TextField label="Name" autoComplete="name" error={errors.name?.message} {...form.register('name')} />
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
      <PasswordField label="Password" autoComplete="new-password" hint={<NewPasswordHint />} error={errors.password?.message} {...form.register('password')} />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Creating your account…' : 'Create account'}
      </Button>
    </form>
  );
}
