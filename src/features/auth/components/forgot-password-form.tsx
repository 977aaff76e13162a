import { zodResolver } from '@hookform/resolvers/zod';
import { MailCheck } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { passwordResetRequestSchema } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

type ForgotPasswordFields = z.input<typeof passwordResetRequestSchema>;

/** Asks for a reset link. The answer never says whether the address has an account. */
export function ForgotPasswordForm() {
  const form = useForm<ForgotPasswordFields, unknown, z.output<typeof passwordResetRequestSchema>>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });
  const [formError, setFormError] = useState<string>();
  const [sentTo, setSentTo] = useState<string>();
  const requestReset = useRequestPasswordReset();
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await requestReset.mutateAsync(input);
      setSentTo(input.email);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['email']));
    }
  });

  if (sentTo) return <LinkSentNotice email={sentTo} onSendAnother={() => setSentTo(undefined)} />;

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
        hint="The address you signed up with."
        error={errors.email?.message}
        {...form.register('email')}
      />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Sending…' : 'Send the reset link'}
      </Button>
    </form>
  );
}

function LinkSentNotice({ email, onSendAnother }: { email: string; onSendAnother: () => void }) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  // The form is gone; put focus on what replaced it so a screen reader reads it next.
  useEffect(() => headingRef.current?.focus(), []);

  return (
    <div className="rounded-card border border-ok/30 bg-ok-wash p-5">
      <h2 ref={headingRef} tabIndex={-1} className="flex items-center gap-2 text-h3">
        <MailCheck aria-hidden="true" className="size-5 text-ok" />
        Check your e-mail
      </h2>
      <p className="mt-2">
        If an account uses <strong className="break-all">{email}</strong>, a link to choose a new password is on its way. The link works once, for 30 minutes.
      </p>
      <p className="mt-2 text-small text-ink-muted">Nothing after a few minutes? Check the spam folder, or ask again.</p>
      <p className="mt-4 flex flex-wrap gap-x-5 gap-y-2">
        <Link to={paths.signIn.getHref()} className="font-semibold text-leaf underline">
          Back to sign in
        </Link>
        <button type="button" onClick={onSendAnother} className="font-semibold text-leaf underline">
          Send another link
        </button>
      </p>
    </div>
  );
}
