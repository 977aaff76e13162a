import { ApiError } from '@/lib/api-client';

/** What a failed self-service change tells the subscriber: the server's reason, and what it means. */
export function describeChangeError(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something unexpected went wrong. Nothing was changed; please try again.';
  if (error.code === 'delivery_locked') {
    return `${error.message} That delivery is past its cutoff and roasts as it is; nothing was changed.`;
  }
  return `${error.message} Nothing was changed.`;
}
