import 'server-only';
import { db } from '@/models';

/** Asks the database one cheap question, giving up after `timeoutMs`. */
export async function checkDatabase(timeoutMs = 2_000): Promise<'ok' | 'down'> {
  try {
    // Raw SQL: the cheapest question a database answers, touching no table.
    const ping = db().sequelize.query('SELECT 1');
    const timeout = new Promise<never>((_, reject) => setTimeout(() => reject(new Error('database ping timed out')), timeoutMs));
    await Promise.race([ping, timeout]);
    return 'ok';
  } catch {
    return 'down';
  }
}
