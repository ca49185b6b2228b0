import type { FormValues } from './types';

// Answers are kept in the browser while an attempt is open, so a reload does not lose them.
const answersKey = (attemptId: number) => `brinewright:attempt:${attemptId}:answers`;
const openKey = (quizSlug: string) => `brinewright:quiz:${quizSlug}:open`;

function safe<T>(fn: () => T, fallback: T): T {
  try {
    return fn();
  } catch {
    return fallback;
  }
}

export function loadAnswers(attemptId: number): FormValues | null {
  return safe(() => {
    const raw = window.localStorage.getItem(answersKey(attemptId));
    return raw ? (JSON.parse(raw) as FormValues) : null;
  }, null);
}

export function saveAnswers(attemptId: number, values: FormValues): void {
  safe(() => window.localStorage.setItem(answersKey(attemptId), JSON.stringify(values)), undefined);
}

export function rememberOpenAttempt(quizSlug: string, attemptId: number): void {
  safe(() => window.localStorage.setItem(openKey(quizSlug), String(attemptId)), undefined);
}

export function openAttemptId(quizSlug: string): number | null {
  return safe(() => {
    const raw = window.localStorage.getItem(openKey(quizSlug));
    return raw && /^\d+$/.test(raw) ? Number(raw) : null;
  }, null);
}

/** Forgets the attempt once it is submitted. */
export function forgetAttempt(quizSlug: string, attemptId: number): void {
  safe(() => {
    window.localStorage.removeItem(answersKey(attemptId));
    if (window.localStorage.getItem(openKey(quizSlug)) === String(attemptId)) window.localStorage.removeItem(openKey(quizSlug));
  }, undefined);
}
