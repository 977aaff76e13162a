import { z } from 'zod';

/** Body of `POST /api/dev/clock` (mounted only when the server runs with RESTDAY_TEST_CLOCK on). */
export const devClockBodySchema = z.object({ now: z.iso.datetime({ offset: true }) });
export type DevClockBody = z.infer<typeof devClockBodySchema>;

/** The clock's reading right after the move. */
export const devClockResponseSchema = z.object({ now: z.iso.datetime({ offset: true }) });
export type DevClockResponse = z.infer<typeof devClockResponseSchema>;
