import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { loadCourses } from '../content/loader';
import { describePlan, planCourseSync, SYNCED_FIELDS, type CourseRow, type SyncPlan } from './plan';

const LOCK_NAME = 'brinewright_course_sync';

export type SyncReport = SyncPlan & { lines: string[] };

/**
 * Brings the `courses` table in line with content/courses/ (see ./plan.ts for what changes).
 * A named database lock, held on its own connection until the work is committed, lets several
 * processes start at once: the later ones wait, then find nothing left to do.
 */
export async function syncCourses(sequelize: Sequelize, options: { contentRoot?: string; lockWaitSeconds?: number } = {}): Promise<SyncReport> {
  const content = loadCourses(options.contentRoot ?? path.join(process.env.BRINEWRIGHT_ROOT ?? process.cwd(), 'content'));
  return sequelize.transaction(async (lockHolder) => {
    // Raw SQL: MariaDB's named lock (GET_LOCK) has no model equivalent; the sync also runs on the migrator's own connection, without the app's models.
    const [got] = await sequelize.query<{ ok: number | null }>('SELECT GET_LOCK(?, ?) AS ok', {
      replacements: [LOCK_NAME, options.lockWaitSeconds ?? 60],
      type: QueryTypes.SELECT,
      transaction: lockHolder,
    });
    if (Number(got?.ok) !== 1) throw new Error(`the course sync waited ${options.lockWaitSeconds ?? 60} s for another process's sync and gave up`);
    try {
      const plan = await sequelize.transaction(async (transaction) => {
        // Raw SQL: the migrator's connection has no models; the reference counts come in the same locking read.
        const rows = await sequelize.query<CourseRow>(
          `SELECT c.id, c.slug, c.title, c.feeCents, c.currency, c.passMarkPct, c.validityMonths,
                  (SELECT COUNT(*) FROM enrollments e WHERE e.courseId = c.id) AS enrollments,
                  (SELECT COUNT(*) FROM workshops w WHERE w.courseId = c.id) + (SELECT COUNT(*) FROM fee_waivers f WHERE f.courseId = c.id)
                    + (SELECT COUNT(*) FROM course_settings s WHERE s.courseId = c.id) AS otherReferences
             FROM courses c FOR UPDATE`,
          { type: QueryTypes.SELECT, transaction },
        );
        const plan = planCourseSync(
          content,
          rows.map((r) => ({
            ...r,
            id: Number(r.id),
            feeCents: Number(r.feeCents),
            passMarkPct: Number(r.passMarkPct),
            validityMonths: Number(r.validityMonths),
            enrollments: Number(r.enrollments),
            otherReferences: Number(r.otherReferences),
          })),
        );
        const now = new Date();
        for (const course of plan.insert) {
          // Raw SQL: the migrator's connection has no models.
          await sequelize.query(
            'INSERT INTO courses (slug, title, feeCents, currency, passMarkPct, validityMonths, createdAt, updatedAt) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
            {
              replacements: [course.slug, course.title, course.feeCents, course.currency, course.passMarkPct, course.validityMonths, now, now],
              transaction,
            },
          );
        }
        for (const update of plan.update) {
          const course = content.find((c) => c.slug === update.slug)!;
          // Only the fields the course file owns: anything else kept for the course stays as it is.
          // Raw SQL: the migrator's connection has no models.
          await sequelize.query(`UPDATE courses SET ${SYNCED_FIELDS.map((f) => `${f} = ?`).join(', ')}, updatedAt = ? WHERE id = ?`, {
            replacements: [...SYNCED_FIELDS.map((f) => course[f]), now, update.id],
            transaction,
          });
        }
        // Raw SQL: the migrator's connection has no models.
        for (const gone of plan.remove) await sequelize.query('DELETE FROM courses WHERE id = ?', { replacements: [gone.id], transaction });
        return plan;
      });
      return { ...plan, lines: describePlan(plan) };
    } finally {
      // Raw SQL: releases the named lock taken above.
      await sequelize.query('SELECT RELEASE_LOCK(?)', { replacements: [LOCK_NAME], transaction: lockHolder });
    }
  });
}
