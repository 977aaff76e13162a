import { Plus } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import type { Address, AddressInput } from '@shared/schemas/account';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { useCreateAddress } from '../api/create-address';
import { useDeleteAddress } from '../api/delete-address';
import { useAddresses } from '../api/get-addresses';
import { useUpdateAddress } from '../api/update-address';
import { AddressCard } from './address-card';
import { AddressForm } from './address-form';

type Editing = { kind: 'new' } | { kind: 'edit'; id: string } | null;

function asDefault({ id: _id, ...fields }: Address): AddressInput {
  return { ...fields, isDefault: true };
}

/** The customer's shipping addresses: list, add, edit, delete, and which one checkout offers first. */
export function AddressBook() {
  const addressesQuery = useAddresses();
  const createAddress = useCreateAddress();
  const updateAddress = useUpdateAddress();
  const deleteAddress = useDeleteAddress();
  const [editing, setEditing] = useState<Editing>(null);
  const [lastEdited, setLastEdited] = useState<string>();
  const [announcement, setAnnouncement] = useState('');
  const addButtonRef = useRef<HTMLButtonElement>(null);
  const wasAdding = useRef(false);

  useEffect(() => {
    // Closing the new-address form puts focus back on the button that opened it.
    const adding = editing?.kind === 'new';
    if (wasAdding.current && !adding) addButtonRef.current?.focus();
    wasAdding.current = adding;
  }, [editing]);

  const openNew = () => {
    setAnnouncement('');
    setEditing({ kind: 'new' });
  };
  const close = (message?: string) => {
    if (editing?.kind === 'edit') setLastEdited(editing.id);
    setEditing(null);
    if (message) setAnnouncement(message);
  };
  const save = async (input: AddressInput) => {
    if (editing?.kind === 'edit') await updateAddress.mutateAsync({ id: editing.id, input });
    else await createAddress.mutateAsync(input);
    close('Address saved.');
  };

  const addButton = (
    <Button ref={addButtonRef} onClick={openNew}>
      <Plus aria-hidden="true" className="size-5" />
      Add an address
    </Button>
  );

  let content;
  if (addressesQuery.data) {
    const items = addressesQuery.data.items;
    content = (
      <>
        {items.length === 0 && editing === null ? (
          <EmptyState title="No addresses yet" action={addButton}>
            Save the address your coffee ships to, and checkout fills it in for you.
          </EmptyState>
        ) : null}
        {items.length > 0 ? (
          <ul aria-label="Your addresses" className="grid gap-4 md:grid-cols-2">
            {items.map((address) =>
              editing?.kind === 'edit' && editing.id === address.id ? (
                <li key={address.id} aria-labelledby="edit-address" className="rounded-card border border-rule bg-sheet p-5 shadow-card md:col-span-2">
                  <h2 id="edit-address" className="mb-4 text-h3">
                    Edit address
                  </h2>
                  <AddressForm address={address} submitLabel="Save address" onSubmit={save} onCancel={() => close()} />
                </li>
              ) : (
                <AddressCard
                  key={address.id}
                  address={address}
                  focusEdit={lastEdited === address.id}
                  onEdit={() => {
                    setAnnouncement('');
                    setEditing({ kind: 'edit', id: address.id });
                  }}
                  onMakeDefault={async () => {
                    await updateAddress.mutateAsync({ id: address.id, input: asDefault(address) });
                    setAnnouncement(`${address.name}’s address is now used first at checkout.`);
                  }}
                  onDelete={async () => {
                    await deleteAddress.mutateAsync(address.id);
                    setAnnouncement('Address deleted.');
                  }}
                />
              ),
            )}
          </ul>
        ) : null}
        {editing?.kind === 'new' ? (
          <section aria-labelledby="new-address" className="mt-6 max-w-xl rounded-card border border-rule bg-sheet p-5 shadow-card">
            <h2 id="new-address" className="mb-4 text-h3">
              New address
            </h2>
            <AddressForm submitLabel="Save address" onSubmit={save} onCancel={() => close()} />
          </section>
        ) : null}
        {items.length > 0 && editing?.kind !== 'new' ? <div className="mt-6">{addButton}</div> : null}
      </>
    );
  } else if (addressesQuery.isError) {
    content = <ErrorState title="Your addresses could not load" error={addressesQuery.error} onRetry={() => void addressesQuery.refetch()} />;
  } else {
    content = (
      <div className="grid gap-4 md:grid-cols-2">
        <p role="status" className="sr-only">
          Loading your addresses…
        </p>
        <Skeleton className="h-48 rounded-card" />
        <Skeleton className="h-48 rounded-card" />
      </div>
    );
  }

  return (
    <div>
      <p role="status" className="mb-4 min-h-6 font-semibold text-ok empty:mb-0 empty:min-h-0">
        {announcement}
      </p>
      {content}
    </div>
  );
}
