import type { Metadata } from 'next';
import Link from 'next/link';
import { InviteForm } from '@/components/admin/invite-form';
import { Card } from '@/components/ui/card';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { formatDateTime } from '@/lib/local-time';
import { getProgramIdentity } from '@/lib/program/settings';
import { describeRoles } from '@/lib/roles';
import { INVITATION_DAYS } from '@/lib/users/invitation-state';
import { fetchOpenInvitations } from '@/lib/users/invitations';

export const metadata: Metadata = { title: 'Staff invitations' };

export default async function InvitationsPage() {
  await requirePageRole('/admin/invitations', 'admin');
  const [open, program] = await Promise.all([fetchOpenInvitations(), getProgramIdentity()]);
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Staff invitations</h1>
      <p className="max-w-prose text-ink-soft">
        The person receives a link that works once, for {INVITATION_DAYS} days, and chooses their own name and password. Inviting the same address again
        replaces the earlier link. An address that already has an account is not invited: change its roles on <Link href="/admin/users">Users and roles</Link>.
      </p>
      <Card>
        <InviteForm />
      </Card>
      <Table caption={`${open.length} open invitation${open.length === 1 ? '' : 's'}`}>
        <THead>
          <TR>
            <TH>E-mail</TH>
            <TH>Roles</TH>
            <TH>Sent</TH>
            <TH>Works until</TH>
          </TR>
        </THead>
        <TBody>
          {open.length === 0 ? <EmptyRow colSpan={4}>No invitation is waiting.</EmptyRow> : null}
          {open.map((i) => (
            <TR key={i.id}>
              <TD>{i.email}</TD>
              <TD>{describeRoles(i.roles)}</TD>
              <TD>
                {formatDateTime(i.createdAt, program.timeZone)}
                {i.invitedBy ? ` by ${i.invitedBy}` : ''}
              </TD>
              <TD>{formatDateTime(i.expiresAt, program.timeZone)}</TD>
            </TR>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
