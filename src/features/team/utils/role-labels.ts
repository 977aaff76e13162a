import type { TeamRole } from '@shared/schemas/team';

export { roleLabels } from '@shared/domain/vocabulary';

/** What each role the owner can give may do, as the invite form and the role menu explain it. */
export const teamRoleDescriptions: Record<TeamRole, string> = {
  packer: 'Packer: the Pack List, shipping and reading orders',
  staff: 'Staff: everything in the Roastery',
  owner: 'Owner: the Roastery, plus the team, settings, prices and refunds',
};
