'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { errorMessage, FetchError, postJson } from '@/lib/fetcher';
import { ROLE_LABELS, ROLES, type Role } from '@/lib/roles';

/** An admin invites a staff member by e-mail with a set of roles (POST /api/admin/invitations). */
export function InviteForm() {
  const router = useRouter();
  const [email, setEmail] = useState('');
  const [roles, setRoles] = useState<Role[]>(['instructor']);
  const [pending, setPending] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; text: string; field?: string } | null>(null);

  async function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    setPending(true);
    setResult(null);
    try {
      const { invitation } = await postJson<{ invitation: { email: string; replaced: number } }>('/api/admin/invitations', { email, roles });
      const replaced = invitation.replaced ? ' The earlier invitation to this address no longer works.' : '';
      setResult({ ok: true, text: `Invitation sent to ${invitation.email}.${replaced}` });
      setEmail('');
      router.refresh();
    } catch (error) {
      const fields = error instanceof FetchError ? error.fields : {};
      setResult({ ok: false, text: errorMessage(error, 'The invitation was not sent. Please try again.'), field: fields.email?.[0] ?? fields.roles?.[0] });
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField label="E-mail" type="email" autoComplete="off" value={email} onChange={(e) => setEmail(e.target.value)} error={result?.field} />
      <fieldset className="flex flex-wrap gap-4">
        <legend className="mb-1 text-sm font-medium">Roles</legend>
        {ROLES.map((r) => (
          <label key={r} className="flex items-center gap-1 text-sm">
            <input
              type="checkbox"
              name="roles"
              value={r}
              checked={roles.includes(r)}
              onChange={(e) => setRoles((held) => ROLES.filter((x) => (x === r ? e.target.checked : held.includes(x))))}
            />
            {ROLE_LABELS[r]}
          </label>
        ))}
      </fieldset>
      <div aria-live="polite">{result ? <p className={result.ok ? 'text-sm text-brine-700' : 'text-sm text-beet-600'}>{result.text}</p> : null}</div>
      <SubmitButton pending={pending}>Send the invitation</SubmitButton>
    </form>
  );
}
