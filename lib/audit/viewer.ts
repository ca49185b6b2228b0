import 'server-only';
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { zonedToUtc } from '@/lib/enrollment/time';
import { AUDIT_PAGE_SIZE, type AuditQuery } from '@/lib/validations/audit';
import { db, type AuditLog } from '@/models';
import { actionWords, knownActions, subjectWords } from './words';

export type AuditRow = {
  id: number;
  at: Date;
  actor: { id: number; name: string; email: string } | null;
  action: string;
  words: string;
  subject: string;
  data: Record<string, unknown> | null;
};
export type AuditPage = { rows: AuditRow[]; total: number; page: number; pages: number };

const nextDay = (day: string) => new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

/** The where clause of the filters; the dates are whole days in `timeZone` (the program's), from the first to the last included. */
export function auditWhere(query: AuditQuery, timeZone: string): WhereOptions<AuditLog> {
  const createdAt: Record<symbol, Date> = {};
  if (query.from) createdAt[Op.gte] = zonedToUtc(query.from, '00:00', timeZone);
  if (query.to) createdAt[Op.lt] = zonedToUtc(nextDay(query.to), '00:00', timeZone);
  return {
    ...(query.person ? { actorId: query.person } : {}),
    ...(query.action ? { action: query.action } : {}),
    ...(query.from || query.to ? { createdAt } : {}),
  };
}

/** One page of the audit log, newest first, with who did it. */
export async function fetchAuditPage(query: AuditQuery, timeZone: string, pageSize = AUDIT_PAGE_SIZE): Promise<AuditPage> {
  const { AuditLog, User } = db();
  const where = auditWhere(query, timeZone);
  const total = await AuditLog.count({ where });
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const page = Math.min(query.page, pages);
  const rows = await AuditLog.findAll({
    where,
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  const actorIds = [...new Set(rows.map((r) => r.actorId).filter((id): id is number => id !== null))];
  const actors = new Map(
    (await User.findAll({ where: { id: actorIds }, attributes: ['id', 'name', 'email'] })).map((u) => [u.id, { id: u.id, name: u.name, email: u.email }]),
  );
  return {
    rows: rows.map((r) => ({
      id: Number(r.id),
      at: r.createdAt,
      actor: r.actorId === null ? null : (actors.get(r.actorId) ?? { id: r.actorId, name: `Account ${r.actorId} (removed)`, email: '' }),
      action: r.action,
      words: actionWords(r.action),
      subject: subjectWords(r.subjectType, r.subjectId),
      data: r.data,
    })),
    total,
    page,
    pages,
  };
}

export type AuditFilterOptions = { people: { id: number; name: string; email: string }[]; actions: { action: string; words: string }[] };

/** Who appears in the log and which kinds of action it holds, for the filter lists. */
export async function fetchAuditFilterOptions(): Promise<AuditFilterOptions> {
  const { sequelize } = db();
  const [people, actions] = await Promise.all([
    sequelize.query<{ id: number; name: string; email: string }>(
      'SELECT u.id, u.name, u.email FROM users u WHERE u.id IN (SELECT DISTINCT actorId FROM audit_logs WHERE actorId IS NOT NULL) ORDER BY u.name, u.id',
      { type: QueryTypes.SELECT },
    ),
    sequelize.query<{ action: string }>('SELECT DISTINCT action FROM audit_logs', { type: QueryTypes.SELECT }),
  ]);
  const all = [...new Set([...knownActions(), ...actions.map((a) => a.action)])];
  return {
    people,
    actions: all.map((action) => ({ action, words: actionWords(action) })).sort((a, b) => a.words.localeCompare(b.words)),
  };
}
