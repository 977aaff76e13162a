/** Escapes text for HTML element content and double-quoted attribute values. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"'`=]/g, (character) => `&#${character.charCodeAt(0)};`);
}

/**
 * A link target for an href: only absolute http(s) URLs pass (the payload schemas already insist
 * on that; this is the second lock). Anything else becomes "#".
 */
export function safeHref(url: string): string {
  try {
    const parsed = new URL(url);
    return parsed.protocol === 'https:' || parsed.protocol === 'http:' ? escapeHtml(parsed.href) : '#';
  } catch {
    return '#';
  }
}
