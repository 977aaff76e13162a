import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { RequireRole } from '@/features/auth/components/require-role';
import { requireUser } from '@/features/auth/utils/require-user';
import { ownerRoles } from '@/features/auth/utils/roles';
import { getShopSettingsQueryOptions, useShopSettings } from '@/features/shop-settings/api/get-shop-settings';
import { ShopSettingsForm } from '@/features/shop-settings/components/shop-settings-form';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Only the owner's browser asks for the settings; anyone else is shown why the page is closed.
    const user = await requireUser(queryClient, request);
    if (ownerRoles.includes(user.role)) void queryClient.prefetchQuery(getShopSettingsQueryOptions());
    return null;
  };

function OwnersSettings() {
  const settings = useShopSettings();
  if (settings.isError) return <ErrorState title="The settings could not load" error={settings.error} onRetry={() => void settings.refetch()} />;
  if (!settings.data) {
    return (
      <div>
        <p role="status" className="sr-only">
          Loading the settings…
        </p>
        <Skeleton className="h-96 rounded-card" />
      </div>
    );
  }
  return <ShopSettingsForm settings={settings.data} />;
}

export default function ShopSettingsRoute() {
  return (
    <RequireRole
      allowed={ownerRoles}
      notAllowed={{ title: 'Settings are for the owner', reason: 'Only the shop’s owner changes roast days, rest, prices and shipping.' }}
    >
      <PageTitle title="Settings · Roastery" />
      <PageHeader eyebrow="Roastery" title="Shop settings" lead="Roast and ship days, rest, the roaster, the loss model, prices and shipping." />
      <OwnersSettings />
    </RequireRole>
  );
}
