import type { Metadata } from 'next';
import { RoleForm } from '@/components/admin/role-form';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchUsers } from '@/lib/data/foundation';

export const metadata: Metadata = { title: 'Users and roles' };

export default async function UsersPage() {
  await requirePageRole('/admin/users', 'admin');
  const users = await fetchUsers();
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Users and roles</h1>
      <p className="max-w-prose text-ink-soft">A new role applies at once: the next page the person opens uses it, without signing in again.</p>
      <Table caption={`${users.length} account${users.length === 1 ? '' : 's'}`}>
        <THead>
          <TR>
            <TH>Name</TH>
            <TH>E-mail</TH>
            <TH>Roles</TH>
          </TR>
        </THead>
        <TBody>
          {users.map((u) => (
            <TR key={u.id}>
              <TD>{u.name}</TD>
              <TD>{u.email}</TD>
              <TD>
                <RoleForm userId={u.id} userName={u.name} roles={u.roles} />
              </TD>
            </TR>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
