import clsx from 'clsx';
import { addressLines } from '@shared/domain/address';
import type { StoredPostalAddress } from '@shared/schemas/address';

type AddressDisplayProps = {
  address: StoredPostalAddress;
  /** Leave the name out where a heading beside the address already shows it. */
  withoutName?: boolean;
  className?: string;
};

/** A postal address, one line under another, as a label prints it. */
export function AddressDisplay({ address, withoutName = false, className }: AddressDisplayProps) {
  const lines = addressLines(address).slice(withoutName ? 1 : 0);
  return (
    <address className={clsx('not-italic', className)}>
      {lines.map((line, index) => (
        <span key={index} className="block">
          {line}
        </span>
      ))}
    </address>
  );
}
