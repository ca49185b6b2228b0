// npm run admin:create -- --email ADDRESS --name "NAME"
// Creates the program's first admin (or makes an existing account an admin). The password comes
// from ADMIN_PASSWORD or is asked for on the terminal; there is no default. Safe to run again.
// Run with the react-server condition so the app's server-only modules load outside Next.
import { createInterface } from 'node:readline';
import { parseArgs } from 'node:util';
import { z } from 'zod';
import { password as passwordPolicy } from '../lib/validations/user';
import { describeRoles } from '../lib/roles';

// The command needs the database only; the session secret is the app server's business.
process.env.NEXTAUTH_SECRET ??= 'not-used-by-admin-create';

/** Reads a line without echoing it (a terminal is required). */
function askHidden(question: string): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: true });
  const muted = rl as unknown as { _writeToOutput: (s: string) => void; output: NodeJS.WriteStream };
  let asked = false;
  muted._writeToOutput = (s: string) => {
    if (!asked) muted.output.write(s);
  };
  return new Promise((resolve) => {
    rl.question(question, (answer) => {
      rl.close();
      process.stdout.write('\n');
      resolve(answer);
    });
    asked = true;
  });
}

async function readPassword(): Promise<string> {
  if (process.env.ADMIN_PASSWORD) return process.env.ADMIN_PASSWORD;
  if (!process.stdin.isTTY) throw new Error('no password: set ADMIN_PASSWORD, or run the command in a terminal to type one');
  const first = await askHidden('Password for the new admin: ');
  const second = await askHidden('The same password again: ');
  if (first !== second) throw new Error('the two passwords differ; nothing was created');
  return first;
}

async function main() {
  const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } }, strict: true });
  if (!values.email || !values.name) throw new Error('usage: npm run admin:create -- --email ADDRESS --name "NAME"');
  const { accountExists, createOrPromoteAdmin } = await import('../lib/users/admin-create');
  try {
    let password: string | undefined;
    if (!(await accountExists(values.email))) {
      const checked = passwordPolicy.safeParse(await readPassword());
      if (!checked.success) throw new Error(`password refused: ${z.prettifyError(checked.error).replace(/^✖ /, '')}`);
      password = checked.data;
    }
    const result = await createOrPromoteAdmin({ email: values.email, name: values.name, password });
    const email = values.email.trim().toLowerCase();
    if (result.outcome === 'created') console.log(`[admin:create] created admin account ${email} (id ${result.userId}); sign in with the password just given`);
    else if (result.outcome === 'promoted')
      console.log(
        `[admin:create] ${email} (id ${result.userId}) held ${describeRoles(result.previousRoles).toLowerCase()}; it is now also an admin (name, password and other roles unchanged)`,
      );
    else console.log(`[admin:create] ${email} (id ${result.userId}) is already an admin; nothing changed`);
  } finally {
    await (globalThis as { __brinewrightSequelize?: { close: () => Promise<void> } }).__brinewrightSequelize?.close();
  }
}

main().catch((error) => {
  const message = error instanceof z.ZodError ? z.prettifyError(error) : error instanceof Error ? error.message : String(error);
  console.error(`[admin:create] ${message}`);
  process.exit(1);
});
