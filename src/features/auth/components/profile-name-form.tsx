import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { profileUpdateSchema } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateProfile } from '../api/update-profile';

type ProfileFields = z.input<typeof profileUpdateSchema>;

export function ProfileNameForm({ user }: { user: User }) {
  const form = useForm<ProfileFields, unknown, z.output<typeof profileUpdateSchema>>({
    resolver: zodResolver(profileUpdateSchema),
    defaultValues: { name: user.name },
  });
  const [outcome, setOutcome] = useState<{ tone: 'alert' | 'status'; message: string }>();
  const updateProfile = useUpdateProfile();
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setOutcome(undefined);
    try {
      const saved = await updateProfile.mutateAsync(input);
      form.reset({ name: saved.name });
      setOutcome({ tone: 'status', message: 'Your name is saved.' });
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ['name']);
      setOutcome(message ? { tone: 'alert', message } : undefined);
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4">
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.message}</FormAlert> : null}
      <TextField label="Name" autoComplete="name" hint="Shown on your orders and e-mail." error={errors.name?.message} {...form.register('name')} />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Save name'}
        </Button>
      </div>
    </form>
  );
}
