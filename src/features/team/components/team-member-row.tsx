import { useState, type FormEvent } from 'react';
import { teamRoles, type TeamMember, type TeamRole } from '@shared/schemas/team';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { ApiError } from '@/lib/api-client';
import { useShopClock } from '@/lib/shop-clock';
import { roleLabels, teamRoleDescriptions } from '../utils/role-labels';

type TeamMemberRowProps = {
  member: TeamMember;
  /** The owner looking at the page: they cannot change their own role or access. */
  isYou: boolean;
  onChangeRole: (role: TeamRole) => Promise<unknown>;
  onSetDisabled: (disabled: boolean) => Promise<unknown>;
};

function isTeamRole(value: string): value is TeamRole {
  return (teamRoles as readonly string[]).includes(value);
}

export function TeamMemberRow({ member, isYou, onChangeRole, onSetDisabled }: TeamMemberRowProps) {
  const clock = useShopClock();
  const [role, setRole] = useState<TeamRole>(isTeamRole(member.role) ? member.role : 'staff');
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string>();
  const headingId = `member-${member.id}`;

  async function run(action: () => Promise<unknown>) {
    setBusy(true);
    setFailure(undefined);
    try {
      await action();
    } catch (error) {
      setFailure(error instanceof ApiError ? error.message : 'That did not work. Please try again.');
    } finally {
      setBusy(false);
    }
  }

  function submitRole(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    void run(() => onChangeRole(role));
  }

  return (
    <li aria-labelledby={headingId} className="rounded-card border border-rule bg-sheet p-5 shadow-card">
      <div className="flex flex-wrap items-center gap-2">
        <h3 id={headingId} className="text-h3">
          {member.name}
          {isYou ? <span className="font-body text-small font-semibold text-ink-muted"> (you)</span> : null}
        </h3>
        <Badge>{roleLabels[member.role]}</Badge>
        {member.disabled ? <Badge tone="alert">Access disabled</Badge> : null}
      </div>
      <p className="mt-1 break-all text-ink-muted">{member.email}</p>
      <p className="text-small text-ink-muted">Joined {clock.date(member.joinedAt)}</p>

      {failure ? (
        <p role="alert" className="mt-3 text-small font-semibold text-alert">
          {failure}
        </p>
      ) : null}

      {isYou ? (
        <p className="mt-3 text-small text-ink-muted">Your own role and access can only be changed by another owner.</p>
      ) : (
        <div className="mt-4 flex flex-wrap items-end gap-3">
          <form onSubmit={submitRole} className="flex flex-wrap items-end gap-3">
            <SelectField
              label="Role"
              value={role}
              aria-describedby={headingId}
              onChange={(event) => {
                if (isTeamRole(event.target.value)) setRole(event.target.value);
              }}
            >
              {teamRoles.map((option) => (
                <option key={option} value={option}>
                  {teamRoleDescriptions[option]}
                </option>
              ))}
            </SelectField>
            <Button type="submit" variant="secondary" disabled={busy || role === member.role} aria-describedby={headingId}>
              Change role
            </Button>
          </form>
          <Button variant="secondary" disabled={busy} onClick={() => void run(() => onSetDisabled(!member.disabled))} aria-describedby={headingId}>
            {member.disabled ? 'Restore access' : 'Disable access'}
          </Button>
        </div>
      )}
    </li>
  );
}
