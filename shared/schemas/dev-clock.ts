import { z } from 'zod';
import { instant } from './dates';

/** Body of `POST /api/dev/clock` (mounted only when the server runs with RESTDAY_TEST_CLOCK on). */
export const devClockBodySchema = z.object({
  now: z.iso
    .datetime({ offset: true })
    .refine(
      (now) => Date.parse(now) >= Date.parse('2000-01-01T00:00:00Z') && Date.parse(now) < Date.parse('2101-01-01T00:00:00Z'),
      'Use an instant between 2000 and 2100.',
    ),
});
export type DevClockBody = z.infer<typeof devClockBodySchema>;

/**
 * The clock's reading right after the move, and the scheduled jobs the move made due (queued once
 * each, as their schedule would have run them; none on a server without a queue).
 */
export const devClockResponseSchema = z.object({ now: instant, dueJobs: z.array(z.string()) });
export type DevClockResponse = z.infer<typeof devClockResponseSchema>;
