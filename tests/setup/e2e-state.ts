import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

// How the browser tests' global setup (the main vitest process) tells each browser file that the
// app it builds and starts in the background answers, or why it will not.
export type E2eState = { status: 'ready'; pid: number } | { status: 'failed'; message: string };

/** Slot `slot`'s app port (1-based): E2E_PORT for the first, then 10 apart (each app's fakes take the next three ports). */
export function e2eSlotPort(basePort: number, slot: number): number {
  return basePort + 10 * (slot - 1);
}

/** One file per port, so several checkouts with their own E2E_PORT do not read each other's. */
export function e2eStatePath(port: number): string {
  return path.join(os.tmpdir(), `brinewright-e2e-${port}.json`);
}

export function writeE2eState(file: string, state: E2eState): void {
  fs.writeFileSync(`${file}.tmp`, JSON.stringify(state));
  fs.renameSync(`${file}.tmp`, file);
}

/** Waits for the state file (the build takes minutes on a busy machine); throws with the setup's reason when it failed. */
export async function waitForE2eState(port: number, timeoutMs: number): Promise<Extract<E2eState, { status: 'ready' }>> {
  const file = e2eStatePath(port);
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (fs.existsSync(file)) {
      const state = JSON.parse(fs.readFileSync(file, 'utf8')) as E2eState;
      if (state.status === 'failed') throw new Error(`The browser tests' app did not start: ${state.message}`);
      return state;
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`The browser tests' app was not ready within ${Math.round(timeoutMs / 60_000)} minutes.`);
}
