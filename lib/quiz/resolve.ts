import { bankFileSchema, type Bank, type BankFile, type ComputeSpec, type ResolvedQuestion } from './schema';

// Turns validated bank files into ready banks: includes merged, numeric answers computed from the
// lib/preserving functions they name, so a change to a table changes the quiz with it.

/** The final exam's limit when its file sets none: 3 attempts in any 24 hours. */
export const FINAL_EXAM_LIMIT = { max: 3, windowHours: 24 };

export type ComputeFns = Record<string, (...args: never[]) => unknown>;

export class BankError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'BankError';
  }
}

/** The number a compute spec names: fn(args) (or fn(...args) for an array), then its `field`. */
export function computeAnswer(spec: ComputeSpec, fns: ComputeFns, where: string): number {
  const fn = fns[spec.compute] as ((...a: unknown[]) => unknown) | undefined;
  if (!fn) throw new BankError(`${where}: unknown compute function "${spec.compute}"`);
  let out: unknown;
  try {
    out = Array.isArray(spec.args) ? fn(...spec.args) : fn(spec.args);
  } catch (error) {
    throw new BankError(`${where}: ${spec.compute} failed: ${(error as Error).message}`);
  }
  let value: unknown = out;
  if (spec.field) {
    for (const part of spec.field.split('.')) value = value && typeof value === 'object' ? (value as Record<string, unknown>)[part] : undefined;
  }
  if (typeof value !== 'number' || !Number.isFinite(value))
    throw new BankError(`${where}: ${spec.compute}${spec.field ? `.${spec.field}` : ''} is not a number`);
  return value;
}

/** A computed answer as an explanation shows it: at most `decimals` places (default 2), no trailing zeros. */
export function formatAnswer(value: number, decimals = 2): string {
  return String(Number(value.toFixed(decimals)));
}

/** Parses raw JSON into a bank file; an error names the file and each wrong field. */
export function parseBankFile(raw: unknown, file: string): BankFile {
  const parsed = bankFileSchema.safeParse(raw);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.') || '(root)'}: ${i.message}`).join('; ');
    throw new BankError(`${file}: ${issues}`);
  }
  return parsed.data;
}

/** Resolves every bank; throws on an unknown include, a duplicate question id, or a draw larger than the bank. */
export function resolveBanks(files: readonly BankFile[], fns: ComputeFns): Map<string, Bank> {
  const bySlug = new Map(files.map((f) => [f.slug, f]));
  const own = new Map<string, ResolvedQuestion[]>();
  for (const f of files) {
    own.set(
      f.slug,
      f.questions.map((q): ResolvedQuestion => {
        if (q.kind !== 'numeric' || typeof q.answer === 'number') return q as ResolvedQuestion;
        const answer = computeAnswer(q.answer, fns, `${f.slug}/${q.id}`);
        return { ...q, answer, computedFrom: q.answer, explanation: q.explanation.replaceAll('{answer}', formatAnswer(answer, q.decimals)) };
      }),
    );
  }
  const banks = new Map<string, Bank>();
  for (const f of files) {
    const questions = [...(own.get(f.slug) ?? [])];
    for (const inc of f.include) {
      if (!bySlug.has(inc)) throw new BankError(`${f.slug}: includes unknown quiz "${inc}"`);
      if (bySlug.get(inc)!.course !== f.course) throw new BankError(`${f.slug}: includes "${inc}" from another course`);
      questions.push(...(own.get(inc) ?? []));
    }
    const seen = new Set<string>();
    for (const q of questions) {
      if (seen.has(q.id)) throw new BankError(`${f.slug}: question id "${q.id}" appears twice`);
      seen.add(q.id);
    }
    if (questions.length === 0) throw new BankError(`${f.slug}: has no questions`);
    const draw = f.draw ?? questions.length;
    if (draw > questions.length) throw new BankError(`${f.slug}: draws ${draw} of only ${questions.length} questions`);
    banks.set(f.slug, {
      slug: f.slug,
      course: f.course,
      lesson: f.lesson,
      title: f.title,
      description: f.description,
      draw,
      attemptLimit: f.attemptLimit ?? (f.slug.endsWith('--final-exam') ? FINAL_EXAM_LIMIT : null),
      timeLimitMinutes: f.timeLimitMinutes ?? null,
      questions,
    });
  }
  return banks;
}
