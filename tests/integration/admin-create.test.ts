// `npm run admin:create` as an operator runs it (a child process), against the real MariaDB.
import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import bcrypt from 'bcryptjs';
import { beforeEach, describe, expect, it } from 'vitest';
import { db } from '@/models';
import { createUser, resetDatabase } from '../support/db';

const run = promisify(execFile);
const ROOT = process.cwd();

async function adminCreate(args: string[], password?: string): Promise<{ code: number; stdout: string; stderr: string }> {
  const env: NodeJS.ProcessEnv = { ...process.env };
  delete env.ADMIN_PASSWORD;
  if (password !== undefined) env.ADMIN_PASSWORD = password;
  try {
    const { stdout, stderr } = await run(path.join(ROOT, 'node_modules/.bin/tsx'), ['--conditions=react-server', 'scripts/admin-create.ts', ...args], {
      cwd: ROOT,
      env,
    });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

const findUser = (email: string) => db().User.findOne({ where: { email } });

describe('npm run admin:create', { timeout: 60_000 }, () => {
  beforeEach(resetDatabase);

  it('creates an admin once; the second run changes nothing', async () => {
    const args = ['--email', 'Ruth.Abara@County.example', '--name', 'Ruth Abara'];
    const first = await adminCreate(args, 'a long enough secret');
    expect(first.code).toBe(0);
    expect(first.stdout).toMatch(/created admin account ruth\.abara@county\.example/);
    const user = (await findUser('ruth.abara@county.example'))!;
    expect({ roles: user.roles, name: user.name, verified: user.emailVerifiedAt !== null }).toEqual({ roles: ['admin'], name: 'Ruth Abara', verified: true });
    expect(await bcrypt.compare('a long enough secret', user.passwordHash)).toBe(true);

    const second = await adminCreate(args, 'a different password');
    expect(second.code).toBe(0);
    expect(second.stdout).toMatch(/already an admin; nothing changed/);
    const again = await db().User.findAll({ where: { email: 'ruth.abara@county.example' } });
    expect(again).toHaveLength(1);
    expect(again[0].passwordHash).toBe(user.passwordHash);
    const audits = await db().AuditLog.findAll({ where: { subjectType: 'user', subjectId: String(user.id) } });
    expect(audits.map((a) => a.action)).toEqual(['user.admin_created']);
  });

  it('refuses a password under the policy and creates nothing', async () => {
    const result = await adminCreate(['--email', 'short@county.example', '--name', 'Short'], 'only9char');
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/password refused: Use at least 10 characters/);
    expect(await findUser('short@county.example')).toBeNull();
  });

  it('has no default password: without ADMIN_PASSWORD and without a terminal it refuses', async () => {
    const result = await adminCreate(['--email', 'nopass@county.example', '--name', 'No Pass']);
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/set ADMIN_PASSWORD/);
    expect(await findUser('nopass@county.example')).toBeNull();
  });

  it('adds admin to an existing account without asking for or changing its password or its other roles', async () => {
    const learner = await createUser('learner', { email: 'teacher@county.example', name: 'Ana Teacher' });
    const hash = (await findUser(learner.email))!.passwordHash;
    const result = await adminCreate(['--email', learner.email, '--name', 'Other Name']);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/held learner; it is now also an admin/);
    const user = (await findUser(learner.email))!;
    expect({ roles: user.roles, name: user.name, hash: user.passwordHash }).toEqual({ roles: ['learner', 'admin'], name: 'Ana Teacher', hash });
    const [audit] = await db().AuditLog.findAll({ where: { subjectType: 'user', subjectId: String(learner.id) } });
    expect(audit.data).toEqual({ from: ['learner'], to: ['learner', 'admin'], by: 'admin:create' });
  });
});
