import { afterAll } from 'vitest';
import { e2eSlotPort, waitForE2eState } from './e2e-state';
import { claimSlot, slotCount, slotDatabaseUrl } from './slots';

// Each browser file takes a free slot (its own app, database and fakes: tests/setup/e2e-global.ts),
// then starts once that app answers (it is built while the other tiers run).
process.env.E2E_BASE_PORT ??= process.env.E2E_PORT ?? '3100';
process.env.E2E_BASE_DATABASE_URL ??= process.env.E2E_DATABASE_URL;
const claim = await claimSlot(process.env.E2E_BASE_DATABASE_URL!, slotCount('E2E_WORKERS'));
afterAll(() => claim.release());
const port = e2eSlotPort(Number(process.env.E2E_BASE_PORT), claim.slot);
Object.assign(process.env, {
  E2E_PORT: String(port),
  E2E_DATABASE_URL: slotDatabaseUrl(process.env.E2E_BASE_DATABASE_URL!, claim.slot),
  E2E_BASE_URL: `http://127.0.0.1:${port}`,
  E2E_PAYMENTS_URL: `http://127.0.0.1:${port + 1}`,
  E2E_MAILBOX_URL: `http://127.0.0.1:${port + 3}`,
});
const { pid } = await waitForE2eState(port, 20 * 60_000);
process.env.E2E_SERVER_PID = String(pid);
