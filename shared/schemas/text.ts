/**
 * Text PostgreSQL can store: no NUL character (text and jsonb refuse it) and no lone UTF-16
 * surrogate (it has no UTF-8 form). Checked once for every request (server/middleware) and for
 * multipart file names.
 */
// eslint-disable-next-line no-control-regex -- finding the NUL character is the point
const unstorable = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function isStorableText(text: string): boolean {
  return !unstorable.test(text);
}

export const unstorableTextMessage = 'Remove the control or broken characters from this text.';

/**
 * The path (`items.0.name`) of the first string, or object key, in `value` that is not storable text,
 * or undefined when every one is.
 */
export function findUnstorableText(value: unknown, path: readonly (string | number)[] = []): string | undefined {
  if (typeof value === 'string') return isStorableText(value) ? undefined : path.join('.') || '_';
  if (Array.isArray(value)) {
    for (const [index, item] of value.entries()) {
      const found = findUnstorableText(item, [...path, index]);
      if (found !== undefined) return found;
    }
    return undefined;
  }
  if (value !== null && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (!isStorableText(key)) return [...path, key].join('.');
      const found = findUnstorableText(item, [...path, key]);
      if (found !== undefined) return found;
    }
  }
  return undefined;
}
