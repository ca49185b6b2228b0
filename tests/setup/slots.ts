// Test files of one project run side by side, each in a slot of its own: an integration file on
// its own database (brinewright_test_1, brinewright_test_2, …), a browser file against its own app,
// database and fakes. The global setups build one of each per slot; each file claims a free slot.
import * as mariadb from 'mariadb';
import { mariadbOptions } from '../support/mariadb-options';

/** How many slots a project has (at most that many of its files run at once): the variable's value, 2 by default (two cores here). */
export function slotCount(variable: 'INTEGRATION_WORKERS' | 'E2E_WORKERS'): number {
  const n = Number(process.env[variable] ?? 2);
  return Number.isInteger(n) && n >= 1 ? n : 2;
}

export const slotList = (count: number) => Array.from({ length: count }, (_, i) => i + 1);

/** Slot `slot`'s database (1-based): the base database's name with `_<slot>` added. */
export function slotDatabaseUrl(baseUrl: string, slot: number): string {
  const url = new URL(baseUrl);
  url.pathname = `${url.pathname}_${slot}`;
  return url.toString();
}

/**
 * Takes a free slot for this test file's process: a MariaDB named lock held on a connection of its
 * own (GET_LOCK), so two files never share one, and a process that dies frees its slot with its
 * connection. vitest's own worker number is not used: a worker kept from an earlier group can repeat it.
 */
export async function claimSlot(baseUrl: string, slots: number): Promise<{ slot: number; release: () => Promise<void> }> {
  const conn = await mariadb.createConnection(mariadbOptions(baseUrl, false));
  const name = new URL(baseUrl).pathname.slice(1);
  for (const until = Date.now() + 30 * 60_000; Date.now() < until;) {
    for (const slot of slotList(slots)) {
      const [row] = await conn.query('SELECT GET_LOCK(?, 0) AS got', [`${name}_slot_${slot}`]);
      if (Number(row.got) === 1) return { slot, release: () => conn.end() };
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  await conn.end();
  throw new Error(`no free test slot of ${name} among ${slots} in 30 minutes`);
}
