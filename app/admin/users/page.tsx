import type { Metadata } from 'next';
import Link from 'next/link';
import { UserActions } from '@/components/admin/user-actions';
import { Badge } from '@/components/ui/badge';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { describeRoles } from '@/lib/roles';
import { fetchUsersPage } from '@/lib/users/directory';
import { UserSearchSchema } from '@/lib/validations/user-admin';

export const metadata: Metadata = { title: 'Users and roles' };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export default async function UsersPage({ searchParams }: Props) {
  await requirePageRole('/admin/users', 'admin');
  const raw = await searchParams;
  const search = UserSearchSchema.parse({ q: one(raw.q), page: one(raw.page) });
  const { users, total, page, pages } = await fetchUsersPage(search);
  const href = (p: number) => `/admin/users?${new URLSearchParams({ ...(search.q ? { q: search.q } : {}), ...(p > 1 ? { page: String(p) } : {}) })}`;
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Users and roles</h1>
      <p className="max-w-prose text-ink-soft">
        An account may hold several roles: a volunteer instructor is also a learner. A change applies at once: the next page the person opens uses it, without
        signing in again. A deactivated account cannot sign in and its sessions end; its enrollments, payments and certificates stay.
      </p>
      <p>
        <Link href="/admin/invitations" className="font-semibold">
          Invite staff by e-mail
        </Link>
      </p>
      <form method="get" action="/admin/users" role="search" className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col text-sm font-medium">
          Name or e-mail
          <input
            type="search"
            name="q"
            defaultValue={search.q}
            maxLength={100}
            className="mt-1 w-72 rounded-lg border border-ink-faint/40 bg-white px-3 py-1.5 font-normal"
          />
        </label>
        <button type="submit" className="rounded-lg bg-brine-700 px-3 py-1.5 font-semibold text-white hover:bg-brine-800">
          Search
        </button>
        {search.q ? (
          <Link href="/admin/users" className="py-1.5 text-sm">
            Show everyone
          </Link>
        ) : null}
      </form>
      <Table
        caption={`${total.toLocaleString('en-US')} account${total === 1 ? '' : 's'}${search.q ? ` matching “${search.q}”` : ''}, page ${page} of ${pages}`}
      >
        <THead>
          <TR>
            <TH>Name</TH>
            <TH>E-mail</TH>
            <TH>Roles</TH>
            <TH>Change</TH>
          </TR>
        </THead>
        <TBody>
          {users.length === 0 ? <EmptyRow colSpan={4}>No account matches that search.</EmptyRow> : null}
          {users.map((u) => (
            <TR key={u.id}>
              <TD>
                {u.name} {u.deactivatedAt ? <Badge tone="beet">Deactivated</Badge> : null}
              </TD>
              <TD>{u.email}</TD>
              <TD>{describeRoles(u.roles)}</TD>
              <TD>
                <UserActions user={{ id: u.id, name: u.name, roles: u.roles, deactivated: u.deactivatedAt !== null }} />
              </TD>
            </TR>
          ))}
        </TBody>
      </Table>
      {pages > 1 ? (
        <nav aria-label="Pages of accounts" className="flex items-center gap-4">
          {page > 1 ? <Link href={href(page - 1)}>← Previous page</Link> : null}
          <span className="text-ink-soft">
            Page {page} of {pages}
          </span>
          {page < pages ? <Link href={href(page + 1)}>Next page →</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
