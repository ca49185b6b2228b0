import { checkDatabase } from '@/lib/health';

export const dynamic = 'force-dynamic';

export async function GET() {
  const dbState = await checkDatabase();
  const body = { status: dbState === 'ok' ? 'ok' : 'degraded', db: dbState };
  return Response.json(body, { status: dbState === 'ok' ? 200 : 503, headers: { 'Cache-Control': 'no-store' } });
}
