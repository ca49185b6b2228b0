'use client';

import { useActionState } from 'react';
import { changeRoleAction, type State } from '@/app/admin/users/actions';
import { Button } from '@/components/ui/button';
import { ROLE_LABELS, ROLES, type Role } from '@/lib/roles';

export function RoleForm({ userId, userName, roles }: { userId: number; userName: string; roles: readonly Role[] }) {
  const [state, action, pending] = useActionState<State, FormData>(changeRoleAction.bind(null, userId), {});
  const messageId = `role-msg-${userId}`;
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <fieldset className="flex flex-wrap gap-3" aria-describedby={messageId}>
        <legend className="sr-only">Roles for {userName}</legend>
        {ROLES.map((r) => (
          <label key={r} className="flex items-center gap-1 text-sm">
            <input type="checkbox" name="roles" value={r} defaultChecked={roles.includes(r)} />
            {ROLE_LABELS[r]}
          </label>
        ))}
      </fieldset>
      <Button type="submit" size="sm" variant="secondary" pending={pending}>
        Save
      </Button>
      <span id={messageId} aria-live="polite" className={state.ok ? 'text-sm text-brine-700' : 'text-sm text-beet-600'}>
        {state.message}
      </span>
    </form>
  );
}
