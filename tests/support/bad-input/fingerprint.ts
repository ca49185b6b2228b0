// A fingerprint of every table's contents (MariaDB CHECKSUM TABLE), to prove that a run of bad
// requests wrote nothing. Tables named in `exclude` are left out; the caller says why.
import { QueryTypes } from 'sequelize';
import { db } from '@/models';

export type Fingerprint = Record<string, string>;

export async function tableNames(): Promise<string[]> {
  const rows = await db().sequelize.query<{ name: string }>(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name',
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.name);
}

/** CHECKSUM TABLE of every table (row count beside it, for a readable failure). */
export async function fingerprint(exclude: readonly string[] = []): Promise<Fingerprint> {
  const names = (await tableNames()).filter((name) => !exclude.includes(name));
  const sums = await db().sequelize.query<{ Table: string; Checksum: string | number | null }>(`CHECKSUM TABLE ${names.map((n) => `\`${n}\``).join(', ')}`, {
    type: QueryTypes.SELECT,
  });
  const counts = await db().sequelize.query<{ name: string; n: number | string }>(
    names.map((n) => `SELECT '${n}' AS name, COUNT(*) AS n FROM \`${n}\``).join(' UNION ALL '),
    { type: QueryTypes.SELECT },
  );
  const count = new Map(counts.map((c) => [c.name, Number(c.n)]));
  const out: Fingerprint = {};
  for (const row of sums) {
    const name = row.Table.split('.').pop()!;
    out[name] = `rows=${count.get(name)} checksum=${row.Checksum}`;
  }
  return out;
}

/** The tables whose fingerprint differs, with before → after. */
export function changedTables(before: Fingerprint, after: Fingerprint): string[] {
  const names = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...names].filter((n) => before[n] !== after[n]).map((n) => `${n}: ${before[n]} → ${after[n]}`);
}
