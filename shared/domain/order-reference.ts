/**
 * The short code people read and say for an order (on its page, its labels and its e-mails): the
 * first eight characters of its id, upper-case, e.g. "3F2A9C1E".
 */
export function orderReference(orderId: string): string {
  return orderId.replace(/-/g, '').slice(0, 8).toUpperCase();
}
