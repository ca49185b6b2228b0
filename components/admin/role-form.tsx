'use client';

import { useActionState } from 'react';
import { changeRoleAction, type State } from '@/app/admin/users/actions';
import { Button } from '@/components/ui/button';
import { ROLE_LABELS, ROLES, type Role } from '@/lib/roles';

export function RoleForm({ userId, userName, role }: { userId: number; userName: string; role: Role }) {
  const [state, action, pending] = useActionState<State, FormData>(changeRoleAction.bind(null, userId), {});
  const messageId = `role-msg-${userId}`;
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <label className="sr-only" htmlFor={`role-${userId}`}>
        Role for {userName}
      </label>
      <select
        id={`role-${userId}`}
        name="role"
        defaultValue={role}
        aria-describedby={messageId}
        className="rounded-lg border border-ink-faint/40 bg-white px-2 py-1"
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </select>
      <Button type="submit" size="sm" variant="secondary" pending={pending}>
        Save
      </Button>
      <span id={messageId} aria-live="polite" className={state.ok ? 'text-sm text-brine-700' : 'text-sm text-beet-600'}>
        {state.message}
      </span>
    </form>
  );
}
