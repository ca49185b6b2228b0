/** "Saturday, December 15, 2026" in the workshop's own time zone. */
export function formatWorkshopDate(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-US', { weekday: 'long', year: 'numeric', month: 'long', day: 'numeric', timeZone }).format(new Date(iso));
}

/** "9:00 AM – 2:00 PM MST" in the workshop's own time zone. */
export function formatWorkshopTimes(startIso: string, endIso: string, timeZone: string): string {
  const time = new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit', timeZone });
  const zone = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' })
    .formatToParts(new Date(startIso))
    .find((p) => p.type === 'timeZoneName')?.value;
  return `${time.format(new Date(startIso))} – ${time.format(new Date(endIso))}${zone ? ` ${zone}` : ''}`;
}

/** "$45.00" from integer cents. */
export function formatMoney(cents: number, currency = 'usd'): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}
