// Integration files run in parallel, each on a database of its own (brinewright_test_1,
// brinewright_test_2, …), so no file sees another's rows. INTEGRATION_WORKERS sets how many
// (2 by default: these machines have two cores, and the files spend much of their time waiting on MariaDB).
import * as mariadb from 'mariadb';

export function integrationWorkers(): number {
  const n = Number(process.env.INTEGRATION_WORKERS ?? 2);
  return Number.isInteger(n) && n >= 1 ? n : 2;
}

/** The database of slot `id` (1-based): the base database's name with `_<id>` added. */
export function workerDatabaseUrl(baseUrl: string, id: number): string {
  const url = new URL(baseUrl);
  url.pathname = `${url.pathname}_${id}`;
  return url.toString();
}

/**
 * Takes a free slot for this test file's process: a MariaDB named lock held on a connection of its
 * own (GET_LOCK), so two files never share a database, and a process that dies frees its slot with
 * its connection. vitest's own worker number is not used: a worker kept from an earlier group can
 * repeat it.
 */
export async function claimWorkerDatabase(baseUrl: string, slots: number): Promise<{ url: string; release: () => Promise<void> }> {
  const url = new URL(baseUrl);
  const conn = await mariadb.createConnection({
    host: url.hostname,
    port: Number(url.port),
    user: decodeURIComponent(url.username),
    password: decodeURIComponent(url.password),
  });
  const name = url.pathname.slice(1);
  for (const until = Date.now() + 120_000; Date.now() < until;) {
    for (let id = 1; id <= slots; id++) {
      const [row] = await conn.query('SELECT GET_LOCK(?, 0) AS got', [`${name}_slot_${id}`]);
      if (Number(row.got) === 1) return { url: workerDatabaseUrl(baseUrl, id), release: () => conn.end() };
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  await conn.end();
  throw new Error(`no free integration database among ${slots} after 120 s`);
}
