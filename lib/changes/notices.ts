import 'server-only';
import { QueryTypes } from 'sequelize';
import { getChanges, getCourses } from '@/lib/content';
import { publishedBy, type CourseChange } from '@/lib/content/changes';
import { enqueueEmail } from '@/lib/email/outbox';
import { courseChangesEmail } from '@/lib/email/templates';
import { getEnv } from '@/lib/env';
import { db } from '@/models';

type Holder = { email: string; name: string };

/**
 * E-mails the holders of a current certificate of each course (unrevoked, not expired) one notice
 * listing the "what changed" entries published since the last run. Each entry is claimed by its
 * id in `change_notices` (unique) in the same transaction as the messages, under a lock on the
 * course's row, so two workers running at once, or a restart, never send an entry twice. Returns the entries announced and the e-mails queued.
 */
export async function queueChangeNotices(now = new Date()): Promise<{ changes: number; emails: number }> {
  const { sequelize } = db();
  const appUrl = getEnv().APP_URL.replace(/\/$/, '');
  let changes = 0;
  let emails = 0;
  for (const course of getCourses()) {
    const record = getChanges(course.slug);
    const published = record ? publishedBy(record.changes, now) : [];
    if (published.length === 0) continue;
    // Raw SQL: ids only, for a quick check before taking the course lock.
    const known = await sequelize.query<{ changeId: string }>('SELECT changeId FROM change_notices WHERE changeId IN (:ids)', {
      replacements: { ids: published.map((c) => c.id) },
      type: QueryTypes.SELECT,
    });
    const seen = new Set(known.map((k) => k.changeId));
    if (published.every((c) => seen.has(c.id))) continue;
    const done = await sequelize.transaction(async (transaction) => {
      // One worker at a time per course: concurrent INSERT IGNOREs of several ids deadlock on the unique index's gaps.
      // Raw SQL: a row lock only (FOR UPDATE), the per-course mutex of the notice job.
      const [locked] = await sequelize.query<{ id: number }>('SELECT id FROM courses WHERE slug = :course FOR UPDATE', {
        replacements: { course: course.slug },
        type: QueryTypes.SELECT,
        transaction,
      });
      if (!locked) return { changes: 0, emails: 0 };
      const claimed: CourseChange[] = [];
      for (const change of published.filter((c) => !seen.has(c.id))) {
        // After the lock, an id another worker committed is ignored here (0 rows).
        // Raw SQL: INSERT IGNORE reports 0 rows for an id another worker claimed, which Model.create cannot express without an error.
        const [, inserted] = (await sequelize.query(
          'INSERT IGNORE INTO change_notices (changeId, courseSlug, recipients, createdAt) VALUES (:id, :course, 0, :now)',
          {
            replacements: { id: change.id, course: course.slug, now },
            type: QueryTypes.INSERT,
            transaction,
          },
        )) as unknown as [unknown, number];
        if (inserted === 1) claimed.push(change);
      }
      if (claimed.length === 0) return { changes: 0, emails: 0 };
      // Raw SQL: a four-table join with DISTINCT, read as flat (email, name) pairs.
      const holders = await sequelize.query<Holder>(
        `SELECT DISTINCT u.email, u.name
           FROM certificates ce
           JOIN enrollments e ON e.id = ce.enrollmentId
           JOIN courses c ON c.id = e.courseId
           JOIN users u ON u.id = ce.userId
          WHERE c.slug = :course AND ce.revokedAt IS NULL AND ce.validUntil >= :now`,
        { replacements: { course: course.slug, now }, type: QueryTypes.SELECT, transaction },
      );
      for (const holder of holders) {
        await enqueueEmail(
          courseChangesEmail({
            to: holder.email,
            name: holder.name,
            courseTitle: course.title,
            changes: claimed,
            changesUrl: `${appUrl}/courses/${course.slug}/changes`,
          }),
          { transaction },
        );
      }
      // Raw SQL: one UPDATE for every claimed id (change_notices has no model: the job is its only writer).
      await sequelize.query('UPDATE change_notices SET recipients = :n WHERE changeId IN (:ids)', {
        replacements: { n: holders.length, ids: claimed.map((c) => c.id) },
        transaction,
      });
      return { changes: claimed.length, emails: holders.length };
    });
    changes += done.changes;
    emails += done.emails;
  }
  return { changes, emails };
}
