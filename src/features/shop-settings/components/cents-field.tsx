import { useState } from 'react';
import { useController, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { toMinorUnits, type CurrencyCode } from '@shared/domain/money';
import { TextField } from '@/components/ui/text-field';

type CentsFieldProps<T extends FieldValues> = {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  currency: CurrencyCode;
  hint?: string;
  error?: string;
};

function toText(cents: unknown): string {
  return typeof cents === 'number' && Number.isFinite(cents) ? (cents / 100).toFixed(2) : '';
}

/** A money amount typed as "18.00" and kept as whole cents (minor units) in the form. */
export function CentsField<T extends FieldValues>({ control, name, label, currency, hint, error }: CentsFieldProps<T>) {
  const {
    field: { value, onChange, onBlur, name: fieldName, ref: inputRef },
  } = useController({ control, name });
  const [text, setText] = useState(() => toText(value));
  const [parseError, setParseError] = useState<string>();
  return (
    <TextField
      label={label}
      hint={hint}
      inputMode="decimal"
      autoComplete="off"
      name={fieldName}
      ref={inputRef}
      value={text}
      error={parseError ?? error}
      onBlur={onBlur}
      onChange={(event) => {
        setText(event.target.value);
        const parsed = toMinorUnits(event.target.value, currency);
        setParseError(parsed.ok ? undefined : parsed.message);
        onChange(parsed.ok ? parsed.value : Number.NaN);
      }}
    />
  );
}
