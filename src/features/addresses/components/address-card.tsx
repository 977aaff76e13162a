import { useEffect, useRef, useState } from 'react';
import type { Address } from '@shared/schemas/account';
import { AddressDisplay } from '@/components/address/address-display';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';

type AddressCardProps = {
  address: Address;
  /** Puts focus on "Edit" when the card appears, as it does when its edit form closes. */
  focusEdit?: boolean;
  onEdit: () => void;
  onMakeDefault: () => Promise<unknown>;
  onDelete: () => Promise<unknown>;
};

function failureMessage(error: unknown): string {
  return error instanceof ApiError ? error.message : 'That did not work. Please try again.';
}

/** One address as it would go on a parcel, with its actions; deleting asks once more first. */
export function AddressCard({ address, focusEdit = false, onEdit, onMakeDefault, onDelete }: AddressCardProps) {
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string>();
  const confirmRef = useRef<HTMLButtonElement>(null);
  const deleteRef = useRef<HTMLButtonElement>(null);
  const editRef = useRef<HTMLButtonElement>(null);
  const wasConfirming = useRef(false);
  const headingId = `address-${address.id}`;

  useEffect(() => {
    if (focusEdit) editRef.current?.focus();
  }, [focusEdit]);

  useEffect(() => {
    // Keyboard focus follows the question, and comes back to "Delete" when it is withdrawn.
    if (confirming) confirmRef.current?.focus();
    else if (wasConfirming.current) deleteRef.current?.focus();
    wasConfirming.current = confirming;
  }, [confirming]);

  async function run(action: () => Promise<unknown>) {
    setBusy(true);
    setFailure(undefined);
    try {
      await action();
    } catch (error) {
      setFailure(failureMessage(error));
    } finally {
      setBusy(false);
    }
  }

  return (
    <li aria-labelledby={headingId} className="rounded-card border border-rule bg-sheet p-5 shadow-card">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={headingId} className="text-h3">
          {address.name}
        </h3>
        {address.isDefault ? <Badge tone="ok">Used first at checkout</Badge> : null}
      </div>
      <AddressDisplay address={address} withoutName className="mt-2 text-ink-muted" />

      {failure ? (
        <p role="alert" className="mt-3 text-small font-semibold text-alert">
          {failure}
        </p>
      ) : null}

      {confirming ? (
        <div className="mt-4 rounded-control border border-alert/40 bg-alert-wash p-3">
          <p className="font-semibold">Delete this address?</p>
          <div className="mt-2 flex flex-wrap gap-3">
            <Button ref={confirmRef} disabled={busy} onClick={() => void run(onDelete)}>
              {busy ? 'Deleting…' : 'Delete address'}
            </Button>
            <Button variant="secondary" disabled={busy} onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </div>
        </div>
      ) : (
        <div className="mt-4 flex flex-wrap gap-3">
          <Button ref={editRef} variant="secondary" onClick={onEdit} aria-describedby={headingId}>
            Edit
          </Button>
          {address.isDefault ? null : (
            <Button variant="secondary" disabled={busy} onClick={() => void run(onMakeDefault)} aria-describedby={headingId}>
              Use first at checkout
            </Button>
          )}
          <Button ref={deleteRef} variant="secondary" onClick={() => setConfirming(true)} aria-describedby={headingId}>
            Delete
          </Button>
        </div>
      )}
    </li>
  );
}
