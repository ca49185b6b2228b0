import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { checkNextAuthRequest, withClearError } from '@/lib/auth/nextauth-request';
import { authOptions } from '@/lib/auth/options';
import { errorResponse } from '@/lib/errors';

type Context = { params: Promise<{ nextauth: string[] }> };

// next-auth 4 reads params synchronously; Next 16 hands them over as a promise. Requests next-auth
// would answer with a 500 are refused with a 400 first (lib/auth/nextauth-request.ts).
async function handler(request: NextRequest, context: Context) {
  try {
    const params = await context.params;
    await checkNextAuthRequest(request, params);
    return await withClearError(await NextAuth(authOptions())(request, { params }));
  } catch (error) {
    return errorResponse(error);
  }
}

export { handler as GET, handler as POST };
