// The course sync of `npm run db:migrate` and of a server start, against the real MariaDB.
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { loadCourses } from '@/lib/content/loader';
import { syncCourses } from '@/lib/courses/sync';
import { createSequelize } from '@/lib/db';
import { rebuildDatabase } from '@/lib/migrator';
import { db } from '@/models';
import { createUser, resetDatabase } from '../support/db';

const run = promisify(execFile);
const ROOT = process.cwd();
const content = loadCourses(path.join(ROOT, 'content'));
const temps: string[] = [];

/** A content folder holding the real course files, each passed through `edit` (null leaves it out). */
function contentWith(edit: (slug: string, text: string) => string | null): string {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-courses-'));
  temps.push(root);
  fs.mkdirSync(path.join(root, 'courses'));
  for (const file of fs.readdirSync(path.join(ROOT, 'content/courses'))) {
    const text = edit(file.replace(/\.mdx$/, ''), fs.readFileSync(path.join(ROOT, 'content/courses', file), 'utf8'));
    if (text !== null) fs.writeFileSync(path.join(root, 'courses', file), text);
  }
  return root;
}

const rows = () =>
  db().sequelize.query<{ id: number; slug: string; title: string; feeCents: number; passMarkPct: number; validityMonths: number }>(
    'SELECT id, slug, title, feeCents, passMarkPct, validityMonths FROM courses ORDER BY slug',
    { type: QueryTypes.SELECT },
  );

afterAll(() => {
  for (const dir of temps) fs.rmSync(dir, { recursive: true, force: true });
});

describe('course sync', () => {
  beforeEach(resetDatabase);

  it('brings every course file into an empty table, then finds nothing to do', async () => {
    const first = await syncCourses(db().sequelize);
    expect(first.insert.map((c) => c.slug).sort()).toEqual(content.map((c) => c.slug).sort());
    const stored = await rows();
    for (const course of content) {
      const row = stored.find((r) => r.slug === course.slug)!;
      expect({ title: row.title, feeCents: Number(row.feeCents), passMarkPct: Number(row.passMarkPct), validityMonths: Number(row.validityMonths) }).toEqual({
        title: course.title,
        feeCents: course.feeCents,
        passMarkPct: course.passMarkPct,
        validityMonths: course.validityMonths,
      });
    }
    const second = await syncCourses(db().sequelize);
    expect(second.lines).toEqual([]);
  });

  it('updates a changed fee and title in place and leaves the settings a coordinator keeps alone', async () => {
    await syncCourses(db().sequelize);
    const [before] = (await rows()).filter((r) => r.slug === 'pickling-and-canning');
    const coordinator = await createUser('coordinator');
    await db().sequelize.query('INSERT INTO course_settings (courseId, refundPolicy, updatedById, createdAt, updatedAt) VALUES (?, ?, ?, NOW(), NOW())', {
      replacements: [before.id, 'Full refund up to 7 days before the workshop.', coordinator.id],
    });

    const edited = contentWith((slug, text) =>
      slug === 'pickling-and-canning'
        ? text
            .replace('feeCents: 4500', 'feeCents: 5200')
            .replace('title: Safe Pickling and Water-Bath Canning', 'title: Safe Pickling and Boiling-Water Canning')
        : text,
    );
    const report = await syncCourses(db().sequelize, { contentRoot: edited });
    expect(report.lines).toEqual([
      'updated pickling-and-canning: title Safe Pickling and Water-Bath Canning -> Safe Pickling and Boiling-Water Canning, feeCents 4500 -> 5200',
    ]);

    const [after] = (await rows()).filter((r) => r.slug === 'pickling-and-canning');
    expect({ id: after.id, title: after.title, feeCents: Number(after.feeCents) }).toEqual({
      id: before.id,
      title: 'Safe Pickling and Boiling-Water Canning',
      feeCents: 5200,
    });
    const [setting] = await db().sequelize.query<{ refundPolicy: string; updatedById: number }>(
      'SELECT refundPolicy, updatedById FROM course_settings WHERE courseId = ?',
      { replacements: [before.id], type: QueryTypes.SELECT },
    );
    expect(setting).toEqual({ refundPolicy: 'Full refund up to 7 days before the workshop.', updatedById: coordinator.id });
  });

  it('keeps a course with enrollments that left content/courses/ and removes one nothing refers to', async () => {
    await syncCourses(db().sequelize);
    const learner = await createUser('learner');
    const [refresher] = (await rows()).filter((r) => r.slug === 'volunteer-refresher');
    await db().Enrollment.create({ userId: learner.id, courseId: refresher.id, runKey: 'self-paced', status: 'active', feeCents: 1500 });
    await db().sequelize.query(
      "INSERT INTO courses (slug, title, feeCents, currency, passMarkPct, validityMonths, createdAt, updatedAt) VALUES ('retired-course', 'Retired', 0, 'usd', 80, 36, NOW(), NOW())",
    );

    const report = await syncCourses(db().sequelize, { contentRoot: contentWith((slug, text) => (slug === 'volunteer-refresher' ? null : text)) });
    expect(report.keep.map((k) => k.slug)).toEqual(['volunteer-refresher']);
    expect(report.remove.map((r) => r.slug)).toEqual(['retired-course']);
    expect((await rows()).map((r) => r.slug)).toEqual(['pickling-and-canning', 'volunteer-refresher']);
  });
});

describe('two processes starting at once', () => {
  const base = new URL(process.env.DATABASE_URL!);
  const url = new URL(base);
  url.pathname = `/${decodeURIComponent(base.pathname.slice(1))}_sync`;

  afterAll(async () => {
    const server = createSequelize(url.toString());
    await server.query(`DROP DATABASE IF EXISTS \`${decodeURIComponent(url.pathname.slice(1))}\``);
    await server.close();
  });

  it('add the courses once: one process adds them, the other waits for its lock and finds nothing to do', { timeout: 120_000 }, async () => {
    await rebuildDatabase(url.toString(), { allowed: /^brinewright_test\w*_sync$/, purpose: 'the course sync test' });
    const tsx = path.join(ROOT, 'node_modules/.bin/tsx');
    const env = { ...process.env, DATABASE_URL: url.toString() };
    const outputs = await Promise.all([0, 1].map(() => run(tsx, ['scripts/migrate.ts', 'sync'], { cwd: ROOT, env })));
    const lines = outputs.map((o) => o.stdout.trim()).sort();
    expect(lines[0]).toMatch(/^\[courses\] added /);
    expect(lines[0].match(/added /g)).toHaveLength(content.length);
    expect(lines[1]).toBe('[courses] in line with content/courses/, nothing changed');

    const sequelize = createSequelize(url.toString());
    try {
      const [count] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM courses', { type: QueryTypes.SELECT });
      expect(Number(count.n)).toBe(content.length);
    } finally {
      await sequelize.close();
    }
  });
});
