import type { Metadata } from 'next';
import { AcceptInvitationForm } from '@/components/auth/accept-invitation-form';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { formatDateTime } from '@/lib/local-time';
import { getProgramIdentity } from '@/lib/program/settings';
import { describeRoles } from '@/lib/roles';
import { CLOSED_MESSAGE } from '@/lib/users/invitation-state';
import { findInvitation } from '@/lib/users/invitations';
import { InvitationTokenSchema } from '@/lib/validations/invitation';

export const metadata: Metadata = { title: 'Your invitation' };
export const dynamic = 'force-dynamic';

export default async function InvitationPage({ searchParams }: { searchParams: Promise<{ token?: string | string[] }> }) {
  const { token } = await searchParams;
  const parsed = InvitationTokenSchema.safeParse(token);
  const invitation = parsed.success ? await findInvitation(parsed.data) : null;
  if (!parsed.success || !invitation) {
    return <Closed title="This invitation link does not work" body="The link is incomplete or unknown. Copy the whole link from the e-mail and try again." />;
  }
  if (invitation.state !== 'open') {
    const titles = { accepted: 'This invitation was already used', replaced: 'This invitation was replaced', expired: 'This invitation has expired' };
    return <Closed title={titles[invitation.state]} body={CLOSED_MESSAGE[invitation.state]} signIn={invitation.state === 'accepted'} />;
  }
  const program = await getProgramIdentity();
  const home =
    invitation.roles.includes('coordinator') || invitation.roles.includes('admin')
      ? '/desk'
      : invitation.roles.includes('instructor')
        ? '/tasting-table'
        : '/pantry';
  return (
    <div className="mx-auto max-w-xl py-10">
      <Card>
        <h1 className="font-display text-2xl font-bold text-brine-900">Join {program.name}</h1>
        <p className="mt-3 text-ink">
          You are invited as <strong>{describeRoles(invitation.roles).toLowerCase()}</strong>, with the address <strong>{invitation.email}</strong>. Choose your
          name and a password. The link works until {formatDateTime(invitation.expiresAt, program.timeZone)}.
        </p>
        <div className="mt-5">
          <AcceptInvitationForm token={parsed.data} email={invitation.email} home={home} />
        </div>
      </Card>
    </div>
  );
}

function Closed({ title, body, signIn = false }: { title: string; body: string; signIn?: boolean }) {
  return (
    <div className="mx-auto max-w-xl py-10">
      <Card>
        <h1 className="font-display text-2xl font-bold text-brine-900">{title}</h1>
        <p className="mt-3 text-ink">{body}</p>
        {signIn ? (
          <div className="mt-5">
            <ButtonLink href="/signin">Sign in</ButtonLink>
          </div>
        ) : null}
      </Card>
    </div>
  );
}
