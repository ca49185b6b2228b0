import 'server-only';
import { randomBytes } from 'node:crypto';
import { CsvError, parse } from 'csv-parse/sync';
import { QueryTypes, type Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { hashPassword } from '@/lib/auth/users';
import { programName } from '@/lib/certificates/issue';
import { generateSerial } from '@/lib/certificates/serial';
import { AppError, clipText } from '@/lib/errors';
import { HOLDER_COLUMNS, HolderFileSchema, HolderLineSchema, REQUIRED_HOLDER_COLUMNS, type HolderLine } from '@/lib/validations/holder-import';
import { db } from '@/models';

export type PreviewLine = {
  /** The line of the file (the header is line 1). */
  line: number;
  outcome: 'create' | 'skip' | 'refuse';
  reason: string | null;
  name: string;
  email: string;
  course: string;
  /** For 'create': whether the holder gets a new account (without a password). */
  newAccount: boolean;
};
export type ImportPreview = { lines: PreviewLine[]; counts: Record<PreviewLine['outcome'], number> };

type Parsed = { line: number; raw: Record<string, string> };

/** The file's own header names, quoted short and printable (a binary or huge first line must not come back whole). */
function unknownList(names: string[]): string {
  const shown = names.slice(0, 5).map((n) => clipText(n, 40));
  return shown.join(', ') + (names.length > 5 ? ` and ${names.length - 5} more` : '');
}

/** Splits the file with the CSV parser; a file that is not CSV or lacks a column is refused as a whole. */
export function parseHolderFile(input: string): Parsed[] {
  const text = HolderFileSchema.parse(input);
  if (text.includes('\u0000')) throw new AppError('bad_request', 'That file is not a CSV text file (it holds binary data).');
  let header: string[] = [];
  let rows: { record: Record<string, string>; info: { lines: number } }[];
  try {
    rows = parse(text, {
      bom: true,
      columns: (names: string[]) => (header = names.map((n) => n.trim().toLowerCase())),
      skip_empty_lines: true,
      trim: true,
      info: true,
    });
  } catch (error) {
    if (error instanceof CsvError) throw new AppError('bad_request', `That file could not be read as CSV: ${error.message}`);
    throw error;
  }
  const missing = REQUIRED_HOLDER_COLUMNS.filter((c) => !header.includes(c));
  const unknown = header.filter((c) => !(HOLDER_COLUMNS as readonly string[]).includes(c));
  if (missing.length || unknown.length) {
    throw new AppError(
      'bad_request',
      [missing.length ? `missing column(s): ${missing.join(', ')}` : '', unknown.length ? `unknown column(s): ${unknownList(unknown)}` : '']
        .filter(Boolean)
        .join('; ') + `. The first line must name the columns ${HOLDER_COLUMNS.join(', ')} (old_serial may be left out).`,
    );
  }
  return rows.map((r) => ({ line: r.info.lines, raw: r.record }));
}

type Planned = PreviewLine & { data?: HolderLine; courseId?: number; courseTitle?: string; userId?: number | null };

/** Decides each line against the database: create, skip as a duplicate, or refuse with the reason. */
async function plan(parsed: Parsed[], transaction?: Transaction): Promise<Planned[]> {
  const { sequelize } = db();
  // Raw SQL: set-wise lookups (every e-mail, serial and certificate of the file at once) read as flat rows inside the import's transaction.
  const q = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
  const courses = await q<{ id: number; slug: string; title: string }>('SELECT id, slug, title FROM courses', {});
  const checked = parsed.map((p) => ({ ...p, result: HolderLineSchema.safeParse(p.raw) }));
  const emails = [...new Set(checked.flatMap((c) => (c.result.success ? [c.result.data.email] : [])))];
  const users = emails.length ? await q<{ id: number; email: string }>('SELECT id, email FROM users WHERE email IN (:emails)', { emails }) : [];
  const userIds = users.map((u) => Number(u.id));
  const held = userIds.length
    ? await q<{ userId: number; courseId: number; serial: string; issuedAt: Date; legacySerial: string | null; importedAt: Date | null }>(
        'SELECT ce.userId, e.courseId, ce.serial, ce.issuedAt, ce.legacySerial, ce.importedAt FROM certificates ce JOIN enrollments e ON e.id = ce.enrollmentId WHERE ce.userId IN (:userIds)',
        { userIds },
      )
    : [];
  const legacy = checked.flatMap((c) => (c.result.success && c.result.data.old_serial ? [c.result.data.old_serial] : []));
  const takenLegacy = new Set(
    legacy.length
      ? (await q<{ legacySerial: string }>('SELECT legacySerial FROM certificates WHERE legacySerial IN (:legacy)', { legacy })).map((r) => r.legacySerial)
      : [],
  );

  const seen = new Map<string, number>();
  const newAccounts = new Set<string>();
  const seenLegacy = new Map<string, number>();
  return checked.map(({ line, raw, result }) => {
    const shown = { line, name: String(raw.name ?? ''), email: String(raw.email ?? ''), course: String(raw.course ?? ''), newAccount: false };
    if (!result.success)
      return {
        ...shown,
        outcome: 'refuse',
        reason: result.error.issues.map((i) => (i.message.includes(':') ? i.message : `${i.path.join('.')}: ${i.message}`)).join('; '),
      };
    const data = result.data;
    const course = courses.find((c) => c.slug === data.course);
    if (!course)
      return { ...shown, outcome: 'refuse', reason: `course: no course "${data.course}" (the courses are ${courses.map((c) => c.slug).join(', ')})` };
    const key = `${data.email} ${data.course}`;
    if (seen.has(key)) return { ...shown, outcome: 'skip', reason: `duplicate of line ${seen.get(key)} (same e-mail and course)` };
    seen.set(key, line);
    const user = users.find((u) => u.email === data.email);
    const existing = user ? held.find((h) => Number(h.userId) === Number(user.id) && Number(h.courseId) === course.id) : undefined;
    if (existing) {
      const sameImport =
        existing.importedAt &&
        new Date(existing.issuedAt).toISOString().slice(0, 10) === data.certificate_date &&
        (existing.legacySerial ?? null) === data.old_serial;
      if (sameImport) return { ...shown, outcome: 'skip', reason: `already imported (serial ${existing.serial})` };
      return { ...shown, outcome: 'refuse', reason: `${data.email} already holds a certificate for ${data.course} (serial ${existing.serial})` };
    }
    if (data.old_serial) {
      if (takenLegacy.has(data.old_serial))
        return { ...shown, outcome: 'refuse', reason: `old_serial ${data.old_serial} already belongs to another certificate` };
      if (seenLegacy.has(data.old_serial))
        return { ...shown, outcome: 'refuse', reason: `old_serial ${data.old_serial} is also on line ${seenLegacy.get(data.old_serial)}` };
      seenLegacy.set(data.old_serial, line);
    }
    const newAccount = !user && !newAccounts.has(data.email);
    if (!user) newAccounts.add(data.email);
    return {
      ...shown,
      outcome: 'create',
      reason: null,
      newAccount,
      data,
      courseId: course.id,
      courseTitle: course.title,
      userId: user ? Number(user.id) : null,
    };
  });
}

const summarize = (lines: Planned[]): ImportPreview => ({
  lines: lines.map(({ line, outcome, reason, name, email, course, newAccount }) => ({ line, outcome, reason, name, email, course, newAccount })),
  counts: {
    create: lines.filter((l) => l.outcome === 'create').length,
    skip: lines.filter((l) => l.outcome === 'skip').length,
    refuse: lines.filter((l) => l.outcome === 'refuse').length,
  },
});

/** What an import of the file would do, line by line; writes nothing. */
export async function previewHolderImport(text: string): Promise<ImportPreview> {
  return summarize(await plan(parseHolderFile(text)));
}

/**
 * Imports the file in one transaction, or nothing when any line is refused. Each new holder gets
 * an account without a usable password (a reset link sets one); each certificate keeps its old
 * serial beside a new one and is marked imported in the audit log.
 */
export async function importHolders(text: string, actorId: number): Promise<ImportPreview> {
  const parsed = parseHolderFile(text);
  const { sequelize, User, Enrollment, Certificate } = db();
  // One hash of a secret nobody keeps: such an account cannot be signed in to until a reset sets a password.
  const unusable = await hashPassword(randomBytes(32).toString('hex'));
  return sequelize.transaction(async (transaction) => {
    // Imports run one after the other (they lock the course rows), so one file imported twice at once creates once.
    // Raw SQL: a lock only (FOR UPDATE on every course row).
    await sequelize.query('SELECT id FROM courses FOR UPDATE', { transaction });
    const lines = await plan(parsed, transaction);
    const preview = summarize(lines);
    if (preview.counts.refuse > 0)
      throw new AppError('unprocessable', `Nothing was imported: ${preview.counts.refuse} line(s) are refused. Correct them and upload the file again.`, {
        extra: { preview },
      });
    const program = await programName(transaction);
    const now = new Date();
    const created = new Map<string, number>();
    for (const l of lines) {
      if (l.outcome !== 'create' || !l.data) continue;
      const d = l.data;
      const userId =
        l.userId ??
        created.get(d.email) ??
        (await User.create({ email: d.email, name: d.name, roles: ['learner'], passwordHash: unusable, emailVerifiedAt: null }, { transaction })).id;
      created.set(d.email, userId);
      const issuedAt = new Date(`${d.certificate_date}T12:00:00Z`);
      const enrollment = await Enrollment.create(
        { userId, courseId: l.courseId!, workshopId: null, runKey: 'imported', status: 'completed', feeCents: 0, completedAt: issuedAt },
        { transaction },
      );
      const certificate = await Certificate.create(
        {
          enrollmentId: enrollment.id,
          userId,
          issuedById: actorId,
          serial: generateSerial(),
          issuedAt,
          validUntil: new Date(`${d.end_date}T12:00:00Z`),
          holderName: d.name,
          courseTitle: l.courseTitle!,
          programName: program,
          signerName: null,
          signerTitle: null,
          legacySerial: d.old_serial,
          importedAt: now,
        },
        { transaction },
      );
      await audit(
        {
          actorId,
          action: 'certificate.imported',
          subjectType: 'certificate',
          subjectId: certificate.id,
          data: { line: l.line, legacySerial: d.old_serial, serial: certificate.serial, newAccount: l.newAccount },
        },
        { transaction },
      );
    }
    return preview;
  });
}
