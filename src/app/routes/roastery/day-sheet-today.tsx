import type { QueryClient } from '@tanstack/react-query';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles } from '@/features/auth/utils/roles';
import { getShopSettingsQueryOptions } from '@/features/shop-settings/api/get-shop-settings';
import { shopToday } from '@/features/shop-settings/utils/shop-today';

/** The Day Sheet's own address in the navigation forwards to the sheet of the shop's today. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const user = await requireUser(queryClient, request);
    // Anyone else is told by the Roastery layout that the page is not for them.
    if (!roasteryRoles.includes(user.role)) return null;
    const settings = await queryClient.ensureQueryData(getShopSettingsQueryOptions()).catch(() => undefined);
    throw redirect(paths.roastery.daySheet.getHref(shopToday(settings)));
  };

export default function DaySheetTodayRoute() {
  return null;
}
