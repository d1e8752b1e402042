/** The garden's calendar day, from the one shared function (shared/calendar/local-day.ts). */
export { localDate } from '#shared/calendar/local-day';
