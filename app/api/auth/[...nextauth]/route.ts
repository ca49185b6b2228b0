import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { checkNextAuthRequest, withClearError } from '@/lib/auth/nextauth-request';
import { asTooManyAttempts } from '@/lib/auth/sign-in-answer';
import { signInRefusal } from '@/lib/auth/sign-in-throttle';
import { authOptions } from '@/lib/auth/options';
import { errorResponse } from '@/lib/errors';

type Context = { params: Promise<{ nextauth: string[] }> };

// next-auth 4 reads params synchronously; Next 16 hands them over as a promise. Requests next-auth
// would answer with a 500 are refused with a 400 first (lib/auth/nextauth-request.ts).
async function handler(request: NextRequest, context: Context) {
  try {
    const params = await context.params;
    await checkNextAuthRequest(request, params);
    // A sign-in refused by the throttle answers 429 with Retry-After (authorize() leaves the seconds here).
    const refusals: number[] = [];
    const response = await signInRefusal.run(refusals, () => NextAuth(authOptions())(request, { params }));
    return await asTooManyAttempts(await withClearError(response), refusals);
  } catch (error) {
    return errorResponse(error);
  }
}

export { handler as GET, handler as POST };
