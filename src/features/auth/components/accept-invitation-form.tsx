import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import type { User } from '@shared/schemas/auth';
import { acceptInvitationSchema, type InvitationPreview } from '@shared/schemas/team';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';
import { NewPasswordHint } from './new-password-hint';

type AcceptInvitationFields = z.input<typeof acceptInvitationSchema>;

type AcceptInvitationFormProps = {
  token: string;
  invitation: InvitationPreview;
  onJoined: (user: User) => void;
};

export function AcceptInvitationForm({ token, invitation, onJoined }: AcceptInvitationFormProps) {
  const form = useForm<AcceptInvitationFields, unknown, z.output<typeof acceptInvitationSchema>>({
    resolver: zodResolver(acceptInvitationSchema),
    defaultValues: { token, name: '', password: '' },
  });
  const [formError, setFormError] = useState<string>();
  const accept = useAcceptInvitation({ onSuccess: onJoined });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await accept.mutateAsync(input);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['name', 'password']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-5">
      {(formError ?? errors.token?.message) ? <FormAlert>{formError ?? errors.token?.message}</FormAlert> : null}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        value={invitation.email}
        readOnly
        hint="The invitation was sent here; you will sign in with it."
      />
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...form.register('name')} />
      <PasswordField label="Password" autoComplete="new-password" hint={<NewPasswordHint />} error={errors.password?.message} {...form.register('password')} />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Joining…' : 'Join the team'}
      </Button>
    </form>
  );
}
