'use client';

import { useId, type ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { PreservingError, parseNumber, type NumberRule } from '@/lib/preserving/errors';
import { useHydrated } from '@/components/ui/use-hydrated';
import { WarningIcon } from '@/components/ui/warning-icon';

/** Reads typed text into numbers, noting a message per field instead of throwing. */
export type Reader = {
  num: (raw: string, rule: NumberRule) => number;
  opt: (raw: string, rule: NumberRule) => number | undefined;
};

export type Outcome<T> = { result?: T; fieldErrors: Record<string, string>; message?: string };

/**
 * Runs a calculator function on what was typed. A bad value becomes the message of its field (the
 * same sentence the /api/tools route answers); outside-table and not-found become `message`.
 */
export function calculate<T>(compute: (read: Reader) => T, fields: readonly string[]): Outcome<T> {
  const fieldErrors: Record<string, string> = {};
  const read: Reader = {
    num(raw, rule) {
      try {
        return parseNumber(raw, rule);
      } catch (error) {
        fieldErrors[rule.param] ??= (error as Error).message;
        return Number.NaN;
      }
    },
    opt(raw, rule) {
      return raw.trim() === '' ? undefined : read.num(raw, rule);
    },
  };
  try {
    const result = compute(read);
    return Object.keys(fieldErrors).length ? { fieldErrors } : { result, fieldErrors };
  } catch (error) {
    if (Object.keys(fieldErrors).length) return { fieldErrors };
    if (!(error instanceof PreservingError)) throw error;
    if (error.kind === 'invalid' && error.param && fields.includes(error.param)) return { fieldErrors: { [error.param]: error.message } };
    return { fieldErrors, message: error.message };
  }
}

const nf = (digits: number) => new Intl.NumberFormat('en-US', { maximumFractionDigits: digits });
/** A number for reading: grouped, at most `digits` decimals. */
export const fmt = (value: number, digits = 2) => nf(digits).format(value);

const EIGHTHS = ['', '1/8', '1/4', '3/8', '1/2', '5/8', '3/4', '7/8'];
/** Kitchen fractions (1/8 steps) where exact, e.g. 0.125 → "1/8", 1.75 → "1 3/4"; else decimals. */
export function kitchen(value: number): string {
  const eighths = Math.round(value * 8);
  if (Math.abs(eighths - value * 8) > 1e-9) return fmt(value, 2);
  const whole = Math.floor(eighths / 8);
  const part = EIGHTHS[eighths % 8];
  return [whole ? String(whole) : '', part].filter(Boolean).join(' ') || '0';
}

type ShellProps = {
  title: string;
  intro: string;
  headingLevel?: 2 | 3;
  lesson: { href: string; label: string };
  caution?: string;
  children: ReactNode;
  result: ReactNode;
  className?: string;
};

/** The frame every calculator shares: heading, short intro, inputs, a live result, caution and lesson link. */
export function CalculatorShell({ title, intro, headingLevel = 3, lesson, caution, children, result, className }: ShellProps) {
  const headingId = useId();
  // Until hydration the fields take no typing (see useHydrated): the result below comes from state.
  const hydrated = useHydrated();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section
      aria-labelledby={headingId}
      className={cn('not-prose my-6 rounded-jar border border-brine-100 bg-white p-5 shadow-shelf', className)}
      data-calculator
    >
      <Heading id={headingId} className="font-display text-lg font-bold text-ink">
        {title}
      </Heading>
      <p className="mt-1 text-sm text-ink-soft">{intro}</p>
      <form className="mt-4" onSubmit={(event) => event.preventDefault()} noValidate>
        <fieldset disabled={!hydrated} className="m-0 grid min-w-0 gap-4 border-0 p-0 sm:grid-cols-2">
          {children}
        </fieldset>
      </form>
      <output aria-live="polite" className="mt-4 block rounded-lg bg-brine-50 p-4 text-ink">
        {result}
      </output>
      {caution ? (
        <p className="mt-3 text-sm text-honey-700">
          <WarningIcon />
          {caution}
        </p>
      ) : null}
      <p className="mt-2 text-sm">
        <a className="font-semibold text-brine-700 underline underline-offset-2 hover:text-brine-900" href={lesson.href}>
          Lesson: {lesson.label}
        </a>
      </p>
    </section>
  );
}

/** The message shown in place of a result when the table does not cover the input. */
export function ResultMessage({ outcome }: { outcome: Outcome<unknown> }) {
  if (outcome.message) return <p className="font-medium text-beet-700">{outcome.message}</p>;
  return <p className="text-ink-soft">Fix the highlighted value to see the result.</p>;
}

export const LESSONS = {
  acidity: { href: '/learn/pickling-and-canning/acidity', label: 'Acidity' },
  salt: { href: '/learn/pickling-and-canning/salt-sugar-and-water', label: 'Salt, sugar and water' },
  crisp: { href: '/learn/pickling-and-canning/preparing-produce-and-keeping-it-crisp', label: 'Preparing produce and keeping it crisp' },
  headspace: { href: '/learn/pickling-and-canning/jars-packing-and-headspace', label: 'Jars, packing and headspace' },
  processing: { href: '/learn/pickling-and-canning/processing', label: 'Processing' },
} as const;

/** The caution every calculator carries in one short line. */
export const ARITHMETIC_ONLY = 'Brinewright checks arithmetic; it never calls a recipe safe. Follow a tested recipe and local guidance.';
