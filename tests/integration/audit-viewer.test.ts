import { beforeAll, describe, expect, it } from 'vitest';
import AuditLogPage from '@/app/desk/audit/page';
import { fetchAuditFilterOptions, fetchAuditPage } from '@/lib/audit/viewer';
import { AuditQuerySchema } from '@/lib/validations/audit';
import { db } from '@/models';
import { createUser, resetDatabase } from '../support/db';
import { actAs } from '../support/session';

const query = (raw: Record<string, string>) => AuditQuerySchema.parse(raw);

describe('the audit log viewer', () => {
  let priya: Awaited<ReturnType<typeof createUser>>;
  let dale: Awaited<ReturnType<typeof createUser>>;

  beforeAll(async () => {
    await resetDatabase();
    priya = await createUser('coordinator', { name: 'Priya Desk' });
    dale = await createUser('admin', { name: 'Dale Admin' });
    const { AuditLog } = db();
    // Chicago is UTC−6 in December (CST, IANA tz database): 05:30 UTC on Dec 3 is 11:30 PM on Dec 2 there.
    await AuditLog.bulkCreate([
      { actorId: priya.id, action: 'certificate.issued', subjectType: 'certificate', subjectId: '11', createdAt: new Date('2026-12-03T05:30:00Z') },
      { actorId: priya.id, action: 'waiver.created', subjectType: 'fee_waiver', subjectId: '4', createdAt: new Date('2026-12-03T06:30:00Z') },
      { actorId: dale.id, action: 'user.roles_changed', subjectType: 'user', subjectId: String(priya.id), createdAt: new Date('2026-12-04T15:00:00Z') },
      { actorId: null, action: 'workshop.reminder_queued', subjectType: 'workshop', subjectId: '2', createdAt: new Date('2026-12-04T16:00:00Z') },
      { actorId: dale.id, action: 'gauge.day_planned', subjectType: 'gauge_day', subjectId: '1', createdAt: new Date('2026-12-05T12:00:00Z') },
    ]);
  });

  it('lists newest first, in plain words, with who did it', async () => {
    const page = await fetchAuditPage(query({}), 'America/Chicago');
    expect(page.total).toBe(5);
    expect(page.rows.map((r) => [r.actor?.name ?? null, r.words, r.subject])).toEqual([
      ['Dale Admin', 'gauge: day planned', 'gauge day 1'],
      [null, 'queued workshop reminders', 'Workshop 2'],
      ['Dale Admin', 'changed the roles of an account', `Account ${priya.id}`],
      ['Priya Desk', 'created a fee waiver code', 'Fee waiver 4'],
      ['Priya Desk', 'issued a certificate', 'Certificate 11'],
    ]);
  });

  it('filters by person, by kind of action, and by whole days in the program’s time zone', async () => {
    expect((await fetchAuditPage(query({ person: String(priya.id) }), 'America/Chicago')).rows.map((r) => r.action)).toEqual([
      'waiver.created',
      'certificate.issued',
    ]);
    expect((await fetchAuditPage(query({ action: 'user.roles_changed' }), 'America/Chicago')).total).toBe(1);
    // Dec 2 in Chicago holds the 05:30 UTC entry of Dec 3; Dec 3 starts at 06:00 UTC.
    const dec2 = await fetchAuditPage(query({ from: '2026-12-02', to: '2026-12-02' }), 'America/Chicago');
    expect(dec2.rows.map((r) => r.action)).toEqual(['certificate.issued']);
    const dec3 = await fetchAuditPage(query({ from: '2026-12-03', to: '2026-12-03' }), 'America/Chicago');
    expect(dec3.rows.map((r) => r.action)).toEqual(['waiver.created']);
    // In UTC both fall on Dec 3.
    expect((await fetchAuditPage(query({ from: '2026-12-03', to: '2026-12-03' }), 'UTC')).total).toBe(2);
    const combined = await fetchAuditPage(query({ person: String(dale.id), from: '2026-12-04' }), 'America/Chicago');
    expect(combined.rows.map((r) => r.action)).toEqual(['gauge.day_planned', 'user.roles_changed']);
    // A filter that does not parse is ignored rather than refused (it came from the address).
    expect(query({ person: 'abc', action: 'DROP TABLE', from: '2026-13-45', page: '-3' })).toEqual({ page: 1 });
  });

  it('pages through the entries', async () => {
    const first = await fetchAuditPage(query({}), 'UTC', 2);
    const third = await fetchAuditPage(query({ page: '3' }), 'UTC', 2);
    expect({ pages: first.pages, first: first.rows.length, third: third.rows.map((r) => r.action) }).toEqual({
      pages: 3,
      first: 2,
      third: ['certificate.issued'],
    });
  });

  it('offers the people and kinds of action the log holds', async () => {
    const options = await fetchAuditFilterOptions();
    expect(options.people.map((p) => p.name)).toEqual(['Dale Admin', 'Priya Desk']);
    expect(options.actions.map((a) => a.action)).toEqual(expect.arrayContaining(['gauge.day_planned', 'user.deactivated', 'certificate.issued']));
  });

  it('is for coordinators and admins: the page refuses an instructor who is also a learner', async () => {
    const props = { searchParams: Promise.resolve({ action: 'waiver.created' }) };
    actAs(await createUser(['learner', 'instructor']));
    await expect(AuditLogPage(props)).rejects.toThrow();
    actAs(priya);
    await expect(AuditLogPage(props)).resolves.toBeTruthy();
  });
});
