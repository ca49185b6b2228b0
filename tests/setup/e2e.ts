import { waitForE2eState } from './e2e-state';

// Each browser file starts once the app of the global setup answers (it is built while the other tiers run).
const { pid } = await waitForE2eState(Number(process.env.E2E_PORT ?? 3100), 20 * 60_000);
process.env.E2E_SERVER_PID = String(pid);
