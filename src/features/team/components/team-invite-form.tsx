import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { teamInvitationSchema, teamRoles, type PendingInvitation } from '@shared/schemas/team';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useInviteTeamMember } from '../api/invite-team-member';
import { teamRoleDescriptions } from '../utils/role-labels';

type InviteFields = z.input<typeof teamInvitationSchema>;

export function TeamInviteForm({ onInvited }: { onInvited: (invitation: PendingInvitation) => void }) {
  const form = useForm<InviteFields, unknown, z.output<typeof teamInvitationSchema>>({
    resolver: zodResolver(teamInvitationSchema),
    defaultValues: { email: '', role: 'staff' },
  });
  const [formError, setFormError] = useState<string>();
  const invite = useInviteTeamMember();
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      const invitation = await invite.mutateAsync(input);
      form.reset();
      onInvited(invitation);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['email']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <TextField
        label="Their e-mail"
        type="email"
        inputMode="email"
        autoComplete="off"
        autoCapitalize="none"
        spellCheck={false}
        hint="They get a link to choose their name and password. It expires, so send it when they are ready."
        error={errors.email?.message}
        {...form.register('email')}
      />
      <SelectField label="Role" {...form.register('role')}>
        {teamRoles.map((role) => (
          <option key={role} value={role}>
            {teamRoleDescriptions[role]}
          </option>
        ))}
      </SelectField>
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
    </form>
  );
}
