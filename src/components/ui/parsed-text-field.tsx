import { useState, type ComponentProps } from 'react';
import { TextField } from './text-field';

type ParsedTextFieldProps<T> = Omit<ComponentProps<typeof TextField>, 'value' | 'defaultValue' | 'onChange'> & {
  value: T;
  onValueChange: (value: T) => void;
  /** The value as text in the box. */
  format: (value: T) => string;
  /** The box's text as a value; text that makes no value should give one the form's schema refuses. */
  parse: (text: string) => T;
};

/**
 * A text box for a value that is not text (cents typed as dollars, a list typed with commas): the
 * person's own text stays as typed while the form holds the parsed value, and a value set from
 * outside (a form reset) replaces the text.
 */
export function ParsedTextField<T>({ value, onValueChange, format, parse, ...props }: ParsedTextFieldProps<T>) {
  const [text, setText] = useState(() => format(value));
  const [shownValue, setShownValue] = useState(value);
  if (!Object.is(value, shownValue)) {
    setShownValue(value);
    if (format(value) !== format(parse(text))) setText(format(value));
  }
  return (
    <TextField
      {...props}
      value={text}
      onChange={(event) => {
        setText(event.target.value);
        onValueChange(parse(event.target.value));
      }}
    />
  );
}
