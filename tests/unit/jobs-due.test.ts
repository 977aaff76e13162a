import { describe, expect, it } from 'vitest';
import { defineJob, jobsDueBetween } from '../../server/jobs/registry';

const run = async () => {};
const everyTenMinutes = defineJob({ name: 'every-ten-minutes', schedule: { cron: '*/10 * * * *' }, run });
const sevenInDenver = defineJob({ name: 'seven-in-denver', schedule: { cron: '0 7 * * *', tz: 'America/Denver' }, run });
const unscheduled = defineJob({ name: 'unscheduled', run });
const all = [everyTenMinutes, sevenInDenver, unscheduled];
const names = (from: string, to: string) => jobsDueBetween(all, new Date(from), new Date(to)).map((job) => job.name);

describe('jobsDueBetween — what a test clock move makes due', () => {
  it('is due when the cron fires after the start and at or before the end, and never for a job without a schedule', () => {
    // 12:01 → 12:09 UTC holds no ten-minute mark; 12:01 → 12:10 holds 12:10 exactly.
    expect(names('2026-12-02T12:01:00Z', '2026-12-02T12:09:59Z')).toEqual([]);
    expect(names('2026-12-02T12:01:00Z', '2026-12-02T12:10:00Z')).toEqual(['every-ten-minutes']);
    // 07:00 in Denver is 14:00 UTC in December (MST, UTC−7; IANA tz database, from memory).
    expect(names('2026-12-02T13:55:00Z', '2026-12-02T13:59:00Z')).toEqual([]);
    expect(names('2026-12-02T13:55:00Z', '2026-12-02T14:00:00Z')).toEqual(['every-ten-minutes', 'seven-in-denver']);
  });

  it('is due once however far the clock jumps, and nothing is due on a move backwards or no move', () => {
    expect(names('2026-12-02T12:00:00Z', '2027-03-01T12:00:00Z')).toEqual(['every-ten-minutes', 'seven-in-denver']);
    expect(names('2026-12-09T12:00:00Z', '2026-12-02T12:00:00Z')).toEqual([]);
    expect(names('2026-12-02T12:00:00Z', '2026-12-02T12:00:00Z')).toEqual([]);
  });
});
