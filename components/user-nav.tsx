'use client';

import Link from 'next/link';
import { signOut, useSession } from 'next-auth/react';
import { LinkPending } from '@/components/ui/link-pending';
import { navFor } from '@/lib/nav';
import { describeRoles } from '@/lib/roles';

export function UserNav() {
  const { data, status } = useSession();
  if (status === 'loading') return <span className="h-6 w-40 animate-pulse rounded bg-brine-700" aria-hidden="true" />;
  if (!data?.user) {
    return (
      <div className="flex items-center gap-3 text-sm">
        <Link href="/signin" className="font-medium text-white no-underline hover:underline">
          Sign in
        </Link>
        <Link href="/register" className="rounded-lg bg-copper-600 px-3 py-1.5 font-semibold text-white no-underline hover:bg-copper-700">
          Register
        </Link>
      </div>
    );
  }
  const { user } = data;
  return (
    <nav aria-label="Your pages" className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
      {navFor(user.roles).map((item) => (
        <Link key={item.href} href={item.href} className="relative font-semibold text-white no-underline hover:underline">
          {item.label}
          <LinkPending />
        </Link>
      ))}
      <span className="text-brine-100" data-testid="signed-in-as">
        {user.name} · {describeRoles(user.roles)}
      </span>
      <Link href="/account" className="relative font-semibold text-white no-underline hover:underline">
        Account
        <LinkPending />
      </Link>
      <button type="button" onClick={() => signOut({ callbackUrl: '/' })} className="rounded border border-brine-400 px-2 py-1 text-white hover:bg-brine-700">
        Sign out
      </button>
    </nav>
  );
}
