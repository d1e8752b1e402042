import { useMutation } from '@tanstack/react-query';
import type { CalendarFeedDto } from '#shared/schemas/calendar';
import { api } from '@/lib/api-client';

export const CALENDAR_FEED_PATH = '/api/me/calendar-feed';

/**
 * The link is fetched only when the grower asks for it (the first ask makes it), never just by
 * opening the page, so no link exists that nobody wanted.
 */
export function getCalendarFeed(): Promise<CalendarFeedDto> {
  return api.get<CalendarFeedDto>(CALENDAR_FEED_PATH);
}

/** A new link; the old one stops working. */
export function replaceCalendarFeed(): Promise<CalendarFeedDto> {
  return api.post<CalendarFeedDto>(CALENDAR_FEED_PATH, {});
}

export function revokeCalendarFeed(): Promise<void> {
  return api.delete(CALENDAR_FEED_PATH);
}

export function useShowCalendarFeed() {
  return useMutation({ mutationFn: getCalendarFeed });
}

export function useReplaceCalendarFeed() {
  return useMutation({ mutationFn: replaceCalendarFeed });
}

export function useRevokeCalendarFeed() {
  return useMutation({ mutationFn: revokeCalendarFeed });
}
