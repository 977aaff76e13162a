/**
 * Every field path of a settings value, parents included ("roaster", "roaster.minLoadPct",
 * "shipping.bands.0.cents"), so a server error keyed by any of them lands on the form.
 */
export function fieldPaths(value: unknown, prefix = ''): string[] {
  if (value === null || typeof value !== 'object') return prefix ? [prefix] : [];
  const entries = Array.isArray(value) ? value.map((item, index) => [String(index), item] as const) : Object.entries(value);
  const nested = entries.flatMap(([key, item]) => fieldPaths(item, prefix ? `${prefix}.${key}` : key));
  return prefix ? [prefix, ...nested] : nested;
}
