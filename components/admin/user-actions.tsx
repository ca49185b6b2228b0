'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { errorMessage, postJson } from '@/lib/fetcher';
import { ROLE_LABELS, ROLES, type Role } from '@/lib/roles';

type Props = { user: { id: number; name: string; roles: Role[]; deactivated: boolean } };

/** One account's role set and its deactivation, each sent to its route handler under /api/admin/users. */
export function UserActions({ user }: Props) {
  const router = useRouter();
  const [roles, setRoles] = useState<Role[]>(user.roles);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, setPending] = useState<'roles' | 'activation' | null>(null);
  const [confirming, setConfirming] = useState(false);
  const messageId = `user-msg-${user.id}`;

  async function send(kind: 'roles' | 'activation', url: string, body: unknown, done: string) {
    setPending(kind);
    setMessage(null);
    try {
      await postJson(url, body);
      setMessage({ ok: true, text: done });
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: errorMessage(error, 'That did not work. Please try again.') });
    } finally {
      setPending(null);
      setConfirming(false);
    }
  }

  const toggle = (role: Role, on: boolean) => setRoles((held) => ROLES.filter((r) => (r === role ? on : held.includes(r))));
  const activation = user.deactivated ? 'reactivate' : 'deactivate';
  return (
    <div className="space-y-2">
      <form
        className="flex flex-wrap items-center gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          void send('roles', `/api/admin/users/${user.id}/roles`, { roles }, 'Roles saved.');
        }}
      >
        <fieldset className="flex flex-wrap gap-3" aria-describedby={messageId}>
          <legend className="sr-only">Roles for {user.name}</legend>
          {ROLES.map((r) => (
            <label key={r} className="flex items-center gap-1 text-sm">
              <input type="checkbox" name="roles" value={r} checked={roles.includes(r)} onChange={(e) => toggle(r, e.target.checked)} />
              {ROLE_LABELS[r]}
            </label>
          ))}
        </fieldset>
        <Button type="submit" size="sm" variant="secondary" pending={pending === 'roles'}>
          Save roles
        </Button>
        <Button type="button" size="sm" variant="secondary" onClick={() => setConfirming(true)} pending={pending === 'activation'}>
          {user.deactivated ? 'Reactivate…' : 'Deactivate…'}
        </Button>
      </form>
      <p id={messageId} aria-live="polite" className={message?.ok ? 'text-sm text-brine-700' : 'text-sm text-beet-600'}>
        {message?.text}
      </p>
      <Dialog
        open={confirming}
        onClose={() => setConfirming(false)}
        title={user.deactivated ? `Reactivate ${user.name}?` : `Deactivate ${user.name}?`}
        footer={
          <>
            <Button type="button" variant="secondary" size="sm" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
            <Button
              type="button"
              size="sm"
              pending={pending === 'activation'}
              onClick={() =>
                void send(
                  'activation',
                  `/api/admin/users/${user.id}/${activation}`,
                  undefined,
                  user.deactivated ? 'Account reactivated.' : 'Account deactivated.',
                )
              }
            >
              {user.deactivated ? 'Reactivate the account' : 'Deactivate the account'}
            </Button>
          </>
        }
      >
        {user.deactivated ? (
          <p>{user.name} will be able to sign in again with their password. Sessions that ended stay ended.</p>
        ) : (
          <p>
            {user.name} will be signed out everywhere and cannot sign in. Their enrollments, payments, certificates and the audit log stay. You can reactivate
            the account later.
          </p>
        )}
      </Dialog>
    </div>
  );
}
