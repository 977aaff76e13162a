import { useId, type ComponentProps } from 'react';
import { TextField } from '@/components/ui/text-field';

type CarrierFieldProps = Omit<ComponentProps<typeof TextField>, 'label' | 'list' | 'hint'> & {
  /** The names of the shop's carriers (Settings), offered as the packer types. */
  carrierNames: readonly string[];
};

/**
 * The carrier's name, with the shop's own carriers offered as suggestions. A carrier from Settings
 * puts a tracking link in the shipped e-mail; any other name still ships, with the number alone.
 */
export function CarrierField({ carrierNames, ...props }: CarrierFieldProps) {
  const listId = useId();
  const offersCarriers = carrierNames.length > 0;
  return (
    <>
      <TextField
        label="Carrier"
        autoComplete="off"
        list={offersCarriers ? listId : undefined}
        hint={
          offersCarriers
            ? `The shop’s carriers (${carrierNames.join(', ')}) put a tracking link in the e-mail; any other carrier sends the number alone.`
            : 'Add the shop’s carriers in Settings to put a tracking link in the e-mail.'
        }
        {...props}
      />
      {offersCarriers ? (
        <datalist id={listId}>
          {carrierNames.map((name) => (
            <option key={name} value={name} />
          ))}
        </datalist>
      ) : null}
    </>
  );
}
