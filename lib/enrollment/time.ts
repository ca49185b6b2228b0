// Wall-clock time in a named zone ↔ UTC instants, with nothing but Intl (the IANA zone data Node ships).

type Parts = { year: number; month: number; day: number; hour: number; minute: number };

/** The wall-clock date and time an instant shows in a time zone. */
export function zonedParts(instant: Date, timeZone: string): Parts {
  const fmt = new Intl.DateTimeFormat('en-US', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
  });
  const get = (type: string) => Number(fmt.formatToParts(instant).find((p) => p.type === type)?.value);
  return { year: get('year'), month: get('month'), day: get('day'), hour: get('hour') % 24, minute: get('minute') };
}

export function isTimeZone(value: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

/**
 * The UTC instant at which the clocks of `timeZone` show `date` (YYYY-MM-DD) and `time` (HH:MM).
 * Found by correcting a first guess with the zone's offset twice, which settles across DST changes;
 * a time skipped by a spring-forward change resolves to the instant an hour later on the wall clock.
 */
export function zonedToUtc(date: string, time: string, timeZone: string): Date {
  const [y, mo, d] = date.split('-').map(Number);
  const [h, mi] = time.split(':').map(Number);
  const wanted = Date.UTC(y, mo - 1, d, h, mi);
  let guess = wanted;
  for (let i = 0; i < 3; i++) {
    const p = zonedParts(new Date(guess), timeZone);
    const shown = Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute);
    if (shown === wanted) break;
    guess += wanted - shown;
  }
  return new Date(guess);
}

const pad = (n: number) => String(n).padStart(2, '0');

/** { date: 'YYYY-MM-DD', time: 'HH:MM' } of an instant in a zone, for filling an edit form. */
export function toZonedInput(instant: Date, timeZone: string): { date: string; time: string } {
  const p = zonedParts(instant, timeZone);
  return { date: `${p.year}-${pad(p.month)}-${pad(p.day)}`, time: `${pad(p.hour)}:${pad(p.minute)}` };
}
