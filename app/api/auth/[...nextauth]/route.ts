import NextAuth from 'next-auth';
import { NextRequest } from 'next/server';
import { checkNextAuthRequest, withClearError } from '@/lib/auth/nextauth-request';
import { asTooManyAttempts } from '@/lib/auth/sign-in-answer';
import { signInRefusal } from '@/lib/auth/sign-in-throttle';
import { authOptions } from '@/lib/auth/options';
import { errorResponse, refuseCrossSite } from '@/lib/errors';
import { JSON_BODY_LIMIT, readBodyBytes } from '@/lib/server/body';

type Context = { params: Promise<{ nextauth: string[] }> };

// next-auth 4 reads params synchronously; Next 16 hands them over as a promise. Requests next-auth
// would answer with a 500 are refused with a 400 first (lib/auth/nextauth-request.ts); a sign-in
// from another site's page is a 403, and a body over 64 KB a 413 before next-auth reads it.
async function handler(request: NextRequest, context: Context) {
  try {
    refuseCrossSite(request);
    const params = await context.params;
    const bounded = request.method === 'POST' ? await withBoundedBody(request) : request;
    await checkNextAuthRequest(bounded, params);
    // A sign-in refused by the throttle answers 429 with Retry-After (authorize() leaves the seconds here).
    const refusals: number[] = [];
    const response = await signInRefusal.run(refusals, () => NextAuth(authOptions())(bounded, { params }));
    return await asTooManyAttempts(await withClearError(response), refusals);
  } catch (error) {
    return errorResponse(error);
  }
}

/** The same request with its body read (at most 64 KB) into memory, for next-auth to read again. */
async function withBoundedBody(request: NextRequest): Promise<NextRequest> {
  const body = await readBodyBytes(request, JSON_BODY_LIMIT);
  return new NextRequest(request.url, { method: request.method, headers: request.headers, body: body as BodyInit | null });
}

export { handler as GET, handler as POST };
