import type { Role } from '@shared/domain/vocabulary';

/** Who may open the Roastery: the shop's team. */
export const roasteryRoles: readonly Role[] = ['staff', 'owner'];
/** Who manages the team, shop settings, prices and refunds. */
export const ownerRoles: readonly Role[] = ['owner'];
/** Every signed-in person: customers, staff and the owner all have an account area. */
export const everyRole: readonly Role[] = ['customer', 'staff', 'owner'];
