import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { answerChoices, readBank } from './support/quiz';

const QUIZ = 'pickling-and-canning--acidity';
const bank = readBank(QUIZ);

const answerEverything = (page: Page) => answerChoices(page, bank.questions);

describe('quiz, progress and the Pantry in the browser', () => {
  // A fresh browser (empty profile) for each person, so one test's session never leaks into the next.
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeEach(async () => {
    browser = await openBrowser();
  });
  afterEach(async () => {
    await browser?.close();
  });

  it('the demo learner reads a lesson, passes its quiz (answers kept across a reload) and sees the jar fill', async () => {
    const { page } = browser;
    await signIn(page, 'learner@cedarhollow.example', 'demo-learner-pass');

    await page.goto('/pantry');
    const jarName = /^Acidity.*: not read yet, quiz not passed yet$/;
    await page.getByRole('img', { name: jarName }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    await page.goto('/learn/pickling-and-canning/acidity');
    const actions = page.getByTestId('lesson-actions');
    await actions.getByRole('button', { name: 'Mark as read' }).click();
    await actions.getByTestId('lesson-read-state').waitFor();
    expect(await actions.getByTestId('lesson-read-state').textContent()).toMatch(/^Read on/);
    expect(await seriousViolations(page)).toEqual([]);
    await actions.getByRole('link', { name: 'Take the lesson quiz' }).click();
    await page.waitForURL(`**/quiz/${QUIZ}`);

    // Before starting and after starting: no explanation (the right-answer marker) in the HTML.
    const explanations = bank.questions.map((q) => q.explanation.slice(0, 50));
    const hasKey = (html: string) => explanations.some((e) => html.includes(e)) || /"(answer|explanation|tolerance|computedFrom)"/.test(html);
    expect(hasKey(await page.content())).toBe(false);
    await page.getByRole('button', { name: 'Start the quiz' }).click();
    await page.locator('fieldset[data-question]').first().waitFor();
    expect(await page.locator('fieldset[data-question]').count()).toBe(bank.questions.length);
    expect(hasKey(await page.content())).toBe(false);
    expect(await seriousViolations(page)).toEqual([]);

    await answerEverything(page);
    await page.locator('fieldset[data-question="acid-two-to-one"]').getByLabel('Your answer').fill('3.3');
    // A reload before submitting keeps the answers.
    await page.reload();
    await page.locator('fieldset[data-question]').first().waitFor();
    expect(await page.locator('fieldset[data-question="acid-two-to-one"]').getByLabel('Your answer').inputValue()).toBe('3.3');
    const tf = bank.questions.find((q) => q.kind === 'true-false')!;
    expect(
      await page
        .locator(`fieldset[data-question="${tf.id}"]`)
        .getByLabel(tf.answer ? 'True' : 'False', { exact: true })
        .isChecked(),
    ).toBe(true);

    await page.getByRole('button', { name: 'Hand in my answers' }).click();
    const result = page.getByTestId('quiz-result');
    await result.waitFor();
    expect(await result.getByRole('heading', { level: 2 }).textContent()).toBe('Passed: 100 %');
    expect(await result.locator('[data-result="right"]').count()).toBe(bank.questions.length);
    expect(await result.textContent()).toContain(bank.questions[0].explanation.slice(0, 50));
    expect(await seriousViolations(page)).toEqual([]);

    await result.getByRole('link', { name: 'Go to your Pantry' }).click();
    await page.waitForURL('**/pantry');
    await page.getByRole('img', { name: /^Acidity.*: read, quiz passed$/ }).waitFor();
    expect(await page.locator('li[data-lesson="acidity"]').getAttribute('data-fill')).toBe('1');
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('link', { name: 'Sign in' }).waitFor();
  });

  it('the demo instructor opens the question results and sorts them', async () => {
    const { page } = browser;
    await signIn(page, 'instructor@cedarhollow.example', 'demo-instructor-pass');
    await page.goto('/tasting-table/questions');
    const table = page.getByTestId('question-results');
    await table.waitFor();
    const row = table.locator('tr[data-question="acid-two-to-one"]');
    await row.waitFor();
    expect(await row.textContent()).toContain('100 %');
    expect(await seriousViolations(page)).toEqual([]);
    await table.getByRole('button', { name: /Answers/ }).click();
    expect(await table.getByRole('columnheader', { name: /Answers/ }).getAttribute('aria-sort')).toBe('ascending');
    await page.getByLabel('Quiz').selectOption(QUIZ);
    await page.getByRole('button', { name: 'Show' }).click();
    await page.waitForURL(/quiz=pickling-and-canning--acidity/);
    expect(await table.locator('tbody tr').count()).toBe(bank.questions.length);
  });
});
