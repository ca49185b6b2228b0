// Integration files run in parallel, each vitest worker on a database of its own
// (brinewright_test_1, brinewright_test_2, …), so no file sees another's rows.
// INTEGRATION_WORKERS sets how many (2 by default: the machines this runs on have two cores and
// the files spend much of their time waiting on MariaDB).
export function integrationWorkers(): number {
  const n = Number(process.env.INTEGRATION_WORKERS ?? 2);
  return Number.isInteger(n) && n >= 1 ? n : 2;
}

/** The database of worker `id` (1-based): the base database's name with `_<id>` added. */
export function workerDatabaseUrl(baseUrl: string, id: number): string {
  const url = new URL(baseUrl);
  url.pathname = `${url.pathname}_${id}`;
  return url.toString();
}
