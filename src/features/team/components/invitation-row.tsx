import { Mail } from 'lucide-react';
import { useState } from 'react';
import type { PendingInvitation } from '@shared/schemas/team';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { useShopClock } from '@/lib/shop-clock';
import { roleLabels } from '../utils/role-labels';

/** An invitation still waiting for an answer, which the owner can withdraw. */
export function InvitationRow({ invitation, onWithdraw }: { invitation: PendingInvitation; onWithdraw: () => Promise<unknown> }) {
  const clock = useShopClock();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string>();
  const emailId = `invitation-${invitation.id}`;

  async function withdraw() {
    setBusy(true);
    setFailure(undefined);
    try {
      await onWithdraw();
    } catch (error) {
      setFailure(error instanceof ApiError ? error.message : 'That did not work. Please try again.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <li className="flex flex-wrap items-center gap-x-3 gap-y-2 px-4 py-3">
      <Mail aria-hidden="true" className="size-4 text-ink-muted" />
      <span id={emailId} className="font-semibold break-all">
        {invitation.email}
      </span>
      <Badge>{roleLabels[invitation.role]}</Badge>
      <span className="text-small text-ink-muted">
        Link expires {clock.dateTime(invitation.expiresAt)}
        {invitation.invitedBy ? ` · sent by ${invitation.invitedBy}` : ''}
      </span>
      <Button variant="secondary" className="ml-auto" disabled={busy} onClick={() => void withdraw()} aria-describedby={emailId}>
        {busy ? 'Withdrawing…' : 'Withdraw'}
      </Button>
      {failure ? (
        <p role="alert" className="w-full text-small font-semibold text-alert">
          {failure}
        </p>
      ) : null}
    </li>
  );
}
