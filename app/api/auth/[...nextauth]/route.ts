import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

type Context = { params: Promise<{ nextauth: string[] }> };

// next-auth 4 reads params synchronously; Next 16 hands them over as a promise.
async function handler(request: Request, context: Context) {
  const params = await context.params;
  return NextAuth(authOptions())(request, { params });
}

export { handler as GET, handler as POST };
