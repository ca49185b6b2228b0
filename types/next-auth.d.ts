import type { Role } from '@/lib/roles';

declare module 'next-auth' {
  interface Session {
    user: { id: number; email: string; name: string; roles: Role[] };
  }
  interface User {
    id: string;
    email: string;
    name: string;
    roles: Role[];
    sessionVersion: number;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: number;
    roles?: Role[];
    /** A token written before accounts held sets of roles (read for one release: lib/auth/session.ts tokenRoles). */
    role?: Role;
    /** The user's sessionVersion at sign-in (lib/auth/sessions.ts). */
    sv?: number;
    /** Sign-in time, seconds since the epoch: the absolute lifetime counts from it. */
    sat?: number;
    iat?: number;
  }
}
