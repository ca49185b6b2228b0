// Every date and time Brinewright shows (pages, e-mails, certificates) goes through this module, in a
// named IANA time zone: the workshop's own, or the program's (program_settings.timeZone). Intl reads
// the IANA tz database that Node ships (its ICU data), so offsets and daylight-saving changes are the
// database's, never computed here. Nothing formats in the server's zone or in UTC by accident.

export type Instant = Date | string | number;

const toDate = (at: Instant) => (at instanceof Date ? at : new Date(at));

// Intl.DateTimeFormat objects are costly to build; one per (options, zone).
const cache = new Map<string, Intl.DateTimeFormat>();
function formatter(options: Intl.DateTimeFormatOptions, timeZone: string): Intl.DateTimeFormat {
  const key = `${timeZone}|${JSON.stringify(options)}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', { ...options, timeZone });
    if (cache.size > 500) cache.clear();
    cache.set(key, f);
  }
  return f;
}

/** The zone's short name at that instant ("CST", "CDT", or "GMT-5" where the database has no abbreviation). */
export function zoneName(at: Instant, timeZone: string): string {
  return (
    formatter({ timeZoneName: 'short' }, timeZone)
      .formatToParts(toDate(at))
      .find((p) => p.type === 'timeZoneName')?.value ?? timeZone
  );
}

/** "December 5, 2026" */
export const formatDate = (at: Instant, timeZone: string) => formatter({ dateStyle: 'long' }, timeZone).format(toDate(at));

/** "Dec 5, 2026" */
export const formatShortDate = (at: Instant, timeZone: string) => formatter({ dateStyle: 'medium' }, timeZone).format(toDate(at));

/** "Saturday, December 5, 2026" */
export const formatLongDate = (at: Instant, timeZone: string) =>
  formatter({ weekday: 'long', year: 'numeric', month: 'long', day: 'numeric' }, timeZone).format(toDate(at));

/** "9:00 AM" */
export const formatTime = (at: Instant, timeZone: string) => formatter({ hour: 'numeric', minute: '2-digit' }, timeZone).format(toDate(at));

/** "Dec 5, 2026, 9:00 AM CST": a moment, with the zone so nobody mistakes it. */
export function formatDateTime(at: Instant, timeZone: string): string {
  return `${formatter({ dateStyle: 'medium', timeStyle: 'short' }, timeZone).format(toDate(at))} ${zoneName(at, timeZone)}`;
}

/** "9:00 AM – 2:00 PM MST", the zone as it is at the start. */
export function formatTimeRange(start: Instant, end: Instant, timeZone: string): string {
  return `${formatTime(start, timeZone)} – ${formatTime(end, timeZone)} ${zoneName(start, timeZone)}`;
}

/** "2026-12-05": the calendar day the instant falls on in the zone (for file names, inputs and grouping by day). */
export function isoDay(at: Instant, timeZone: string): string {
  const parts = formatter({ year: 'numeric', month: '2-digit', day: '2-digit' }, timeZone).formatToParts(toDate(at));
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}

/** A calendar day written as YYYY-MM-DD (a dated change, a certificate date), shown as "December 5, 2026" with no zone shift. */
export function formatCalendarDay(day: string): string {
  return formatter({ dateStyle: 'long' }, 'UTC').format(new Date(`${day}T12:00:00Z`));
}
