/**
 * The private calendar feed (iCalendar) of a signed-in user: every garden they are a member of,
 * each planting's likely harvest window and each open alert.
 */

/** GET /api/me/calendar-feed (creates the link on the first call) and POST (a new link). */
export interface CalendarFeedDto {
  /** The secret address calendar apps subscribe to; null when it can no longer be shown (make a new one). */
  url: string | null;
  createdAt: string;
}
