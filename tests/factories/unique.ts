// Values no other test uses, so test files sharing one database read only their own rows.
import { randomInt, randomUUID } from 'node:crypto';

/** A run-unique prefix, so lot codes never collide with another file's rows. */
export const runTag = () => randomUUID().slice(0, 6).toUpperCase();

/** A fresh e-mail recipient per test, so each test reads only its own mail from the shared catcher. */
export function testAddress(tag: string): string {
  return `${tag}-${randomUUID().slice(0, 8)}@example.test`;
}

/**
 * A ship day no other test uses: a random day in 2040–2089, so each test reads only its own
 * orders from the shared database (and the real clock's scheduled jobs never reach them).
 */
export function uniqueDay(): string {
  const day = new Date(Date.UTC(2040, 0, 1) + randomInt(0, 50 * 365) * 86_400_000);
  return day.toISOString().slice(0, 10);
}

export function dayAfter(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}
