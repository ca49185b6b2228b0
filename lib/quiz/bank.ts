import 'server-only';
import fs from 'node:fs';
import path from 'node:path';
import { COMPUTE_FNS, convertUnits } from './compute';
import { parseBankFile, resolveBanks } from './resolve';
import type { Bank } from './schema';

// Loads content/quizzes/*.json once per process, validated with zod; a broken file fails loudly.

let cache: Map<string, Bank> | null = null;

function quizDir(): string {
  return path.join(process.env.BRINEWRIGHT_ROOT ?? process.cwd(), 'content', 'quizzes');
}

/** Reads and resolves every bank (no cache), for tests and the loader. */
export function loadBanks(dir = quizDir()): Map<string, Bank> {
  const files = fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => {
      const parsed = parseBankFile(JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8')), f);
      if (`${parsed.slug}.json` !== f) throw new Error(`${f}: its slug is "${parsed.slug}"; the file must be named after it`);
      return parsed;
    });
  return resolveBanks(files, COMPUTE_FNS);
}

function banks(): Map<string, Bank> {
  if (!cache || process.env.NODE_ENV === 'development') cache = loadBanks();
  return cache;
}

export function getBank(slug: string): Bank | null {
  return banks().get(slug) ?? null;
}

export function getBanks(): Bank[] {
  return [...banks().values()];
}

export { convertUnits };
