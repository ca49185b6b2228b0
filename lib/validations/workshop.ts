import { z } from 'zod';
import { isTimeZone } from '@/lib/enrollment/time';

export const WORKSHOP_TIME_ZONES = [
  { value: 'America/New_York', label: 'Eastern (New York)' },
  { value: 'America/Chicago', label: 'Central (Chicago)' },
  { value: 'America/Denver', label: 'Mountain (Denver)' },
  { value: 'America/Phoenix', label: 'Mountain, no DST (Phoenix)' },
  { value: 'America/Los_Angeles', label: 'Pacific (Los Angeles)' },
  { value: 'America/Anchorage', label: 'Alaska (Anchorage)' },
  { value: 'Pacific/Honolulu', label: 'Hawaii (Honolulu)' },
] as const;

const id = (what: string) =>
  z.coerce
    .number({ error: `Choose ${what}.` })
    .int(`Choose ${what}.`)
    .positive(`Choose ${what}.`);

/** The coordinator's workshop form, shared by the client form and the route handlers. */
export const WorkshopSchema = z
  .object({
    courseId: id('a course'),
    date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter the date as YYYY-MM-DD.'),
    startTime: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Enter the start time as HH:MM.'),
    endTime: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Enter the end time as HH:MM.'),
    timeZone: z.string().refine(isTimeZone, 'Choose a time zone.'),
    place: z.string().trim().min(3, 'Enter the place (at least 3 characters).').max(300, 'Use at most 300 characters for the place.'),
    seats: z.coerce
      .number({ error: 'Enter the number of seats.' })
      .int('Seats must be a whole number.')
      .min(1, 'A workshop needs at least 1 seat.')
      .max(200, 'At most 200 seats.'),
    instructorId: z.union([z.literal(''), z.null(), id('an instructor')]).transform((v) => (v === '' || v === null ? null : v)),
    attendanceRequired: z.boolean(),
  })
  .refine((v) => v.endTime > v.startTime, { path: ['endTime'], message: 'The workshop must end after it starts (same day).' });

export type WorkshopInput = z.input<typeof WorkshopSchema>;
export type WorkshopValues = z.output<typeof WorkshopSchema>;

export const AttendanceSchema = z.object({ enrollmentId: z.coerce.number().int().positive(), attended: z.boolean() });

/** A workshop's id in the address. */
export const WorkshopIdSchema = z.coerce.number().int().positive();
