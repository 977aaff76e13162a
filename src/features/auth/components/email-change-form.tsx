import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { emailChangeSchema } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangeEmail } from '../api/change-email';

type EmailChangeFields = z.input<typeof emailChangeSchema>;

/** A new sign-in address; the current password confirms it is the account's holder asking. */
export function EmailChangeForm({ user }: { user: User }) {
  const form = useForm<EmailChangeFields, unknown, z.output<typeof emailChangeSchema>>({
    resolver: zodResolver(emailChangeSchema),
    defaultValues: { email: user.email, currentPassword: '' },
  });
  const [outcome, setOutcome] = useState<{ tone: 'alert' | 'status'; message: string }>();
  const changeEmail = useChangeEmail();
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setOutcome(undefined);
    try {
      const saved = await changeEmail.mutateAsync(input);
      form.reset({ email: saved.email, currentPassword: '' });
      setOutcome({ tone: 'status', message: `You now sign in with ${saved.email}.` });
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ['email', 'currentPassword']);
      setOutcome(message ? { tone: 'alert', message } : undefined);
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4">
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.message}</FormAlert> : null}
      <TextField
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="email"
        autoCapitalize="none"
        spellCheck={false}
        hint="You sign in with it, and order and rest-day e-mails go to it."
        error={errors.email?.message}
        {...form.register('email')}
      />
      <PasswordField
        label="Current password"
        autoComplete="current-password"
        hint="To confirm it is you."
        error={errors.currentPassword?.message}
        {...form.register('currentPassword')}
      />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Change e-mail'}
        </Button>
      </div>
    </form>
  );
}
