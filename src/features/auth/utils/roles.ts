import type { Role } from '@shared/domain/vocabulary';

/** Who may open the Roastery: the shop's team, the packer included. */
export const roasteryRoles: readonly Role[] = ['packer', 'staff', 'owner'];
/** Who runs the whole Roastery: lots and stock, the Roast Calendar, the Roast List, subscribers. */
export const staffRoles: readonly Role[] = ['staff', 'owner'];
/** Who manages the team, shop settings, prices and refunds. */
export const ownerRoles: readonly Role[] = ['owner'];
/** Every signed-in person: customers, the team and the owner all have an account area. */
export const everyRole: readonly Role[] = ['customer', 'packer', 'staff', 'owner'];
