// Schema messages that read as the end of a sentence about the field ("is required").
const predicate = /^(is|are|must|has|have|lists|would|should)\b/;

/**
 * A field's error as a sentence: "Name is required", "Use at most two decimals". `notANumber`
 * replaces the schema's type complaint for a box where text did not make a number.
 */
export function fieldErrorText(error: { type?: string; message?: string } | undefined, label: string, notANumber = 'Enter a number.'): string | undefined {
  if (!error) return undefined;
  if (error.type === 'invalid_type') return notANumber;
  const message = error.message ?? 'Check this field.';
  if (predicate.test(message)) return `${label} ${message}.`;
  return `${message.charAt(0).toUpperCase()}${message.slice(1)}${/[.!?]$/.test(message) ? '' : '.'}`;
}
