import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { getAddressesQueryOptions } from '@/features/addresses/api/get-addresses';
import { AddressBook } from '@/features/addresses/components/address-book';
import { requireUser } from '@/features/auth/utils/require-user';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Only a signed-in person has addresses to load; a visitor is on the way to sign-in.
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getAddressesQueryOptions());
    return null;
  };

export default function AddressesRoute() {
  return (
    <>
      <PageTitle title="Addresses" />
      <PageHeader title="Addresses" lead="Where your green coffee and Roasted to Order bags ship. Checkout fills in the one marked “Used first at checkout”." />
      <AddressBook />
    </>
  );
}
