import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { getEnv } from '@/lib/env';
import { SignInSchema } from '@/lib/validations/user';
import { ThrottledError } from './sign-in-throttle';
import { tokenRoles } from './session';
import { sessionIsLive } from './sessions';
import { currentAccount, verifyCredentials } from './users';

type HeaderBag = Record<string, string | string[] | undefined> | Headers | undefined;

/** The client's address as the nearest proxy saw it; 'local' when there is no proxy header. */
export function clientAddress(headers: HeaderBag): string {
  const read = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const value = headers[name];
    return Array.isArray(value) ? value[0] : value;
  };
  const forwarded = read('x-forwarded-for')?.split(',')[0]?.trim();
  return (forwarded || read('x-real-ip') || 'local').slice(0, 64);
}

export function authOptions(): NextAuthOptions {
  const env = getEnv();
  return {
    secret: env.NEXTAUTH_SECRET,
    session: { strategy: 'jwt', maxAge: 8 * 60 * 60 },
    pages: { signIn: '/signin', error: '/signin' },
    providers: [
      CredentialsProvider({
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        async authorize(credentials, req) {
          const parsed = SignInSchema.safeParse(credentials ?? {});
          if (!parsed.success) return null;
          try {
            const user = await verifyCredentials(parsed.data.email, parsed.data.password, clientAddress(req?.headers));
            return user ? { id: String(user.id), email: user.email, name: user.name, roles: user.roles, sessionVersion: user.sessionVersion } : null;
          } catch (error) {
            // next-auth passes the message to the sign-in form as the error code.
            if (error instanceof ThrottledError) throw new Error('Throttled');
            throw error;
          }
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          token.uid = Number(user.id);
          token.roles = user.roles;
          token.sv = user.sessionVersion;
          token.sat = Math.floor(Date.now() / 1000);
        } else if (typeof token.uid === 'number') {
          const account = await currentAccount(token.uid);
          const stamp = { sessionVersion: token.sv ?? 0, signedInAt: token.sat ?? token.iat ?? 0 };
          // An ended session: next-auth answers the browser's session request with no session and clears the cookie.
          if (!sessionIsLive(stamp, account, { nowSeconds: Date.now() / 1000, maxAgeDays: env.SESSION_MAX_DAYS })) throw new Error('Session ended');
          // The browser's session (its menus) follows roles an admin changed; the server's checks
          // read the roles from the database on every request anyway (lib/auth/guard.ts).
          token.roles = account!.roles;
          // A token from before role sets: rewritten with the set on its first refresh.
          delete token.role;
        }
        return token;
      },
      async session({ session, token }) {
        session.user = { id: token.uid, email: token.email ?? '', name: token.name ?? '', roles: token.roles ?? tokenRoles(token) ?? [] };
        return session;
      },
    },
  };
}
