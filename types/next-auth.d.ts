import type { Role } from '@/lib/roles';

declare module 'next-auth' {
  interface Session {
    user: { id: number; email: string; name: string; role: Role };
  }
  interface User {
    id: string;
    email: string;
    name: string;
    role: Role;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: number;
    role: Role;
  }
}
