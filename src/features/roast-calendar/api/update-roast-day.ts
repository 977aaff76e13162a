import { useMutation, useQueryClient } from '@tanstack/react-query';
import { calendarDayUpdateResponseSchema, type CalendarDayUpdate, type CalendarDayUpdateResponse } from '@shared/schemas/roastery';
import { apiRequest } from '@/lib/api-client';

/** Opens or closes a roast day, or sets its capacity and note. Closing moves its orders on. */
export function updateRoastDay({ date, update }: { date: string; update: CalendarDayUpdate }): Promise<CalendarDayUpdateResponse> {
  return apiRequest(`/api/roastery/calendar/${encodeURIComponent(date)}`, { method: 'PUT', body: update, schema: calendarDayUpdateResponseSchema });
}

export function useUpdateRoastDay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateRoastDay,
    // Moved orders change other days' loads too, and any Roast List that shows them.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['roastery'] }),
  });
}
