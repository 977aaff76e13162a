import { queryOptions, useQuery } from '@tanstack/react-query';
import { calendarResponseSchema, type CalendarResponse } from '@shared/schemas/roastery';
import { apiRequest } from '@/lib/api-client';

/** Roast days from `from` to `to` (both inclusive): open or closed, capacity, planned green load. */
export function getRoastCalendar({ from, to, signal }: { from: string; to: string; signal?: AbortSignal }): Promise<CalendarResponse> {
  return apiRequest('/api/roastery/calendar', { schema: calendarResponseSchema, params: new URLSearchParams({ from, to }), signal });
}

export function getRoastCalendarQueryOptions(range: { from: string; to: string }) {
  return queryOptions({
    queryKey: ['roastery', 'calendar', range],
    queryFn: ({ signal }) => getRoastCalendar({ ...range, signal }),
  });
}

export function useRoastCalendar(range: { from: string; to: string }) {
  return useQuery(getRoastCalendarQueryOptions(range));
}
