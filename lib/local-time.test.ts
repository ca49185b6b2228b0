import { describe, expect, it } from 'vitest';
import { formatCalendarDay, formatDate, formatDateTime, formatLongDate, formatTimeRange, isoDay, zoneName } from './local-time';

// Expected values follow the IANA tz database (America/Chicago: CST = UTC−6, CDT = UTC−5; in 2026
// daylight saving time begins Sunday March 8 at 2:00 local and ends Sunday November 1 at 2:00 local,
// the US rule of the Energy Policy Act of 2005 as the database records it). Computed by hand from it.
describe('local times', () => {
  it('shows one UTC instant in Chicago on each side of the autumn change', () => {
    // 06:30 UTC on Nov 1 is 1:30 AM CDT (UTC−5), the first of the two 1:30s that morning.
    expect(formatDateTime('2026-11-01T06:30:00Z', 'America/Chicago')).toBe('Nov 1, 2026, 1:30 AM CDT');
    // An hour later the clocks have gone back: 07:30 UTC is 1:30 AM CST (UTC−6), the second one.
    expect(formatDateTime('2026-11-01T07:30:00Z', 'America/Chicago')).toBe('Nov 1, 2026, 1:30 AM CST');
  });

  it('shows the spring change in Chicago: 2:00 AM local never happens', () => {
    expect(formatDateTime('2026-03-08T07:59:00Z', 'America/Chicago')).toBe('Mar 8, 2026, 1:59 AM CST');
    expect(formatDateTime('2026-03-08T08:00:00Z', 'America/Chicago')).toBe('Mar 8, 2026, 3:00 AM CDT');
  });

  it('puts an evening instant on the local day, not on the UTC one', () => {
    // 02:00 UTC on Dec 6 is still the evening of Dec 5 in Denver (MST, UTC−7).
    expect(formatDate('2026-12-06T02:00:00Z', 'America/Denver')).toBe('December 5, 2026');
    expect(isoDay('2026-12-06T02:00:00Z', 'America/Denver')).toBe('2026-12-05');
    expect(isoDay('2026-12-06T02:00:00Z', 'UTC')).toBe('2026-12-06');
    expect(formatLongDate('2026-12-06T02:00:00Z', 'America/Denver')).toBe('Saturday, December 5, 2026');
  });

  it('names the zone of a range at its start', () => {
    expect(formatTimeRange('2026-12-19T16:00:00Z', '2026-12-19T21:00:00Z', 'America/Denver')).toBe('9:00 AM – 2:00 PM MST');
    expect(zoneName('2026-07-01T12:00:00Z', 'America/Denver')).toBe('MDT');
    // Arizona keeps standard time all year (no DST in the tz database's America/Phoenix).
    expect(zoneName('2026-07-01T12:00:00Z', 'America/Phoenix')).toBe('MST');
  });

  it('shows a calendar day as written, whatever the zone of the server', () => {
    expect(formatCalendarDay('2026-03-08')).toBe('March 8, 2026');
    expect(formatCalendarDay('2026-12-31')).toBe('December 31, 2026');
  });
});
