import type { QueryClient } from '@tanstack/react-query';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles, staffRoles } from '@/features/auth/utils/roles';
import { getShopSettingsQueryOptions } from '@/features/shop-settings/api/get-shop-settings';
import { shopToday } from '@/features/shop-settings/utils/shop-today';
import { getTodayQueryOptions } from '@/features/today/api/get-today';

/** The Day Sheet's own address in the navigation forwards to the next roast day's sheet: today's when today roasts. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const user = await requireUser(queryClient, request);
    // Anyone else is told by the Roastery layout that the page is not for them.
    if (!roasteryRoles.includes(user.role)) return null;
    if (!staffRoles.includes(user.role)) {
      // A packer packs: the shop's today, on its Pack List.
      const settings = await queryClient.ensureQueryData(getShopSettingsQueryOptions()).catch(() => undefined);
      throw redirect(paths.roastery.daySheet.getHref(shopToday(settings), 'pack'));
    }
    const today = await queryClient.fetchQuery(getTodayQueryOptions()).catch(() => undefined);
    if (today?.nextRoastDay) throw redirect(paths.roastery.daySheet.getHref(today.nextRoastDay.date));
    // No roast day ahead, or Today could not load: the shop's today.
    const settings = await queryClient.ensureQueryData(getShopSettingsQueryOptions()).catch(() => undefined);
    throw redirect(paths.roastery.daySheet.getHref(today?.today ?? shopToday(settings)));
  };

export default function DaySheetTodayRoute() {
  return null;
}
