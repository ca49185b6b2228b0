import bcrypt from 'bcryptjs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadLessons } from '../../lib/content/loader';
import { connect } from './support/authorization-fixtures';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { answerChoices, readBank } from './support/quiz';

// The fermenting lesson arrived with content version 2 of the flagship course: a learner enrolled
// under it has nine jars and reads the lesson and passes its quiz; the demo learner, enrolled before
// it (version 1, the column's default), keeps eight. Lesson lists are read from the content.
const lessons = loadLessons(path.resolve(__dirname, '../../content'), 'pickling-and-canning');
const LESSON = lessons.find((l) => l.slug === 'fermented-pickles-and-sauerkraut')!;
const bank = readBank(LESSON.quiz);
const PASSWORD = 'fermenting-e2e-pass-123';

describe('the fermenting lesson in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const email = `fermenting-${Date.now()}@test.example`;

  beforeAll(async () => {
    const conn = await connect();
    try {
      const now = new Date();
      const user = await conn.query(
        "INSERT INTO users (email, name, passwordHash, roles, emailVerifiedAt, createdAt, updatedAt) VALUES (?, 'Noor Fermenter', ?, 'learner', ?, ?, ?)",
        [email, bcrypt.hashSync(PASSWORD, 10), now, now, now],
      );
      const [course] = (await conn.query("SELECT id FROM courses WHERE slug = 'pickling-and-canning'")) as { id: number }[];
      await conn.query(
        "INSERT INTO enrollments (userId, courseId, workshopId, runKey, status, feeCents, contentVersion, createdAt, updatedAt) VALUES (?, ?, NULL, 'self-paced', 'active', 0, 2, ?, ?)",
        [Number(user.insertId), course.id, now, now],
      );
    } finally {
      await conn.end();
    }
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('a learner enrolled under the current content sees nine jars, reads the new lesson and passes its quiz', async () => {
    const { page } = browser;
    await signIn(page, email, PASSWORD);
    await page.goto('/pantry');
    const shelf = page.getByTestId('shelf-pickling-and-canning');
    await shelf.locator(`li[data-lesson="${LESSON.slug}"]`).waitFor();
    expect(await shelf.locator('li[data-lesson]').count()).toBe(lessons.length);
    expect(lessons.length).toBe(9);
    await page.getByRole('img', { name: `${LESSON.title}: not read yet, quiz not passed yet` }).waitFor();

    await page.goto(`/learn/pickling-and-canning/${LESSON.slug}`);
    expect(await page.getByRole('heading', { level: 1, name: LESSON.title }).count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'Keep everything under the brine' }).count()).toBe(1);
    await page.getByRole('region', { name: 'Salt by weight and brine strength' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    const actions = page.getByTestId('lesson-actions');
    await actions.getByRole('button', { name: 'Mark as read' }).click();
    await actions.getByTestId('lesson-read-state').waitFor();
    await actions.getByRole('link', { name: 'Take the lesson quiz' }).click();
    await page.waitForURL(`**/quiz/${LESSON.quiz}`);
    await page.getByRole('button', { name: 'Start the quiz' }).click();
    await page.locator('fieldset[data-question]').first().waitFor();
    expect(await page.locator('fieldset[data-question]').count()).toBe(bank.questions.length);
    await answerChoices(page, bank.questions);
    await page.getByRole('button', { name: 'Hand in my answers' }).click();
    const result = page.getByTestId('quiz-result');
    await result.waitFor();
    expect(await result.getByRole('heading', { level: 2 }).textContent()).toBe('Passed: 100 %');
    expect(await seriousViolations(page)).toEqual([]);

    await page.goto('/pantry');
    await page.getByRole('img', { name: `${LESSON.title}: read, quiz passed` }).waitFor();
    expect(await page.locator(`li[data-lesson="${LESSON.slug}"]`).getAttribute('data-fill')).toBe('1');
  });

  it('the demo learner, enrolled before the lesson, keeps eight jars and is not asked for it', async () => {
    // A browser of its own: in the shared one, a request of the first learner's page still open
    // could set that learner's session cookie again between clearing the cookies and signing in.
    const own = await openBrowser();
    try {
      const { page } = own;
      await signIn(page, 'learner@cedarhollow.example', 'demo-learner-pass');
      await page.goto('/pantry');
      const shelf = page.getByTestId('shelf-pickling-and-canning');
      await shelf.locator('li[data-lesson="acidity"]').waitFor();
      expect(await shelf.locator('li[data-lesson]').count()).toBe(8);
      expect(await shelf.locator(`li[data-lesson="${LESSON.slug}"]`).count()).toBe(0);
      expect(await page.getByText(LESSON.title).count()).toBe(0);
    } finally {
      await own.close();
    }
  });

  it('the course page counts nine lessons and links its dated "what changed" page, which names each change\'s source', async () => {
    const page = await browser.context.newPage();
    await page.goto('/courses/pickling-and-canning');
    const requirements = page.getByRole('region', { name: 'To earn the certificate' });
    expect(await requirements.textContent()).toContain('Read all nine lessons and pass each lesson quiz.');
    await requirements.getByRole('link', { name: 'What changed in this course' }).click();
    await page.waitForURL('**/courses/pickling-and-canning/changes');
    await page.getByRole('heading', { level: 1, name: 'What changed in this course' }).waitFor();
    const list = page.getByRole('list', { name: 'Changes, newest first' });
    expect(await list.getByRole('listitem').count()).toBeGreaterThan(3);
    expect(await list.textContent()).toContain('New lesson 8, Fermented pickles and sauerkraut');
    expect(await list.textContent()).toContain('NCHFP fact sheet Using Atmospheric Steam Canners');
    await list
      .getByRole('link', { name: `Lesson 8: ${LESSON.title}` })
      .first()
      .waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.close();
  });
});
