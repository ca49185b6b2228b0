import { stringify } from 'csv-stringify/sync';
import type { DeskEnrollment } from './enrollments';

export const ROSTER_COLUMNS = [
  { key: 'learner', header: 'Learner' },
  { key: 'email', header: 'E-mail' },
  { key: 'course', header: 'Course' },
  { key: 'workshopDate', header: 'Workshop date' },
  { key: 'workshopPlace', header: 'Workshop place' },
  { key: 'status', header: 'Enrollment status' },
  { key: 'eligible', header: 'Eligible' },
  { key: 'missing', header: 'Missing' },
  { key: 'serial', header: 'Certificate serial' },
  { key: 'issued', header: 'Issued' },
  { key: 'validUntil', header: 'Valid until' },
  { key: 'certificateState', header: 'Certificate state' },
] as const;

/** A cell a spreadsheet would run as a formula (OWASP "CSV injection") starts with an apostrophe instead. */
export const neutralise = (value: string) => (/^[=+\-@\t\r]/.test(value) ? `'${value}` : value);

const day = (iso: string | undefined | null) => (iso ? iso.slice(0, 10) : '');

/**
 * The roster as CSV (RFC 4180 quoting by csv-stringify), with a UTF-8 byte-order mark so that a
 * spreadsheet opening the file reads it as UTF-8 and keeps accents; commas in names are quoted.
 * CRLF line ends, as RFC 4180 writes them.
 */
export function rosterCsv(rows: readonly DeskEnrollment[]): string {
  const records = rows.map((r) => ({
    learner: neutralise(r.learnerName),
    email: neutralise(r.learnerEmail),
    course: neutralise(r.courseTitle),
    workshopDate: day(r.workshop?.startsAt),
    workshopPlace: neutralise(r.workshop?.place ?? ''),
    status: r.status,
    eligible: r.certificate ? 'certified' : r.eligible ? 'yes' : 'no',
    missing: r.checks
      .filter((c) => !c.met)
      .map((c) => c.label)
      .join('; '),
    serial: r.certificate?.serial ?? '',
    issued: day(r.certificate?.issuedAt),
    validUntil: day(r.certificate?.validUntil),
    certificateState: r.certificate?.state ?? '',
  }));
  return stringify(records, { header: true, bom: true, record_delimiter: 'windows', columns: ROSTER_COLUMNS.map((c) => ({ key: c.key, header: c.header })) });
}
