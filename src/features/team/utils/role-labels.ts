import type { Role } from '@shared/domain/vocabulary';
import type { TeamRole } from '@shared/schemas/team';

export const roleLabels: Record<Role, string> = {
  customer: 'Customer',
  staff: 'Staff',
  owner: 'Owner',
};

/** What each role the owner can give may do, as the invite form and the role menu explain it. */
export const teamRoleDescriptions: Record<TeamRole, string> = {
  staff: 'Staff: everything in the Roastery',
  owner: 'Owner: the Roastery, plus the team, settings, prices and refunds',
};
