import { formatLongDate, formatTimeRange } from '@/lib/local-time';

/** "Saturday, December 15, 2026" in the workshop's own time zone. */
export const formatWorkshopDate = (iso: string, timeZone: string): string => formatLongDate(iso, timeZone);

/** "9:00 AM – 2:00 PM MST" in the workshop's own time zone. */
export const formatWorkshopTimes = (startIso: string, endIso: string, timeZone: string): string => formatTimeRange(startIso, endIso, timeZone);

/** "$45.00" from integer cents. */
export function formatMoney(cents: number, currency = 'usd'): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}
