import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

// A bank's key, read from its file as a learner who knows the material would know it (the browser never receives it).
export type BankQuestion = { id: string; kind: string; prompt: string; choices?: { id: string; text: string }[]; answer: unknown; explanation: string };

export function readBank(slug: string): { questions: BankQuestion[] } {
  return JSON.parse(fs.readFileSync(path.join(process.cwd(), 'content/quizzes', `${slug}.json`), 'utf8')) as { questions: BankQuestion[] };
}

/** Ticks the right choice of every single, multiple and true-false question shown (numeric ones are left to the caller). */
export async function answerChoices(page: Page, questions: readonly BankQuestion[]) {
  for (const q of questions) {
    const group = page.locator(`fieldset[data-question="${q.id}"]`);
    if (q.kind === 'single' || q.kind === 'multiple') {
      const right = q.kind === 'single' ? [q.answer as string] : (q.answer as string[]);
      for (const id of right) await group.getByLabel(q.choices!.find((c) => c.id === id)!.text, { exact: true }).check();
    } else if (q.kind === 'true-false') {
      await group.getByLabel(q.answer ? 'True' : 'False', { exact: true }).check();
    }
  }
}
