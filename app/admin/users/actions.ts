'use server';

import { revalidatePath } from 'next/cache';
import { requireRole } from '@/lib/auth/guard';
import { AppError, fieldErrors } from '@/lib/errors';
import { changeRoles } from '@/lib/users-admin';
import { RoleChangeSchema } from '@/lib/validations/role-change';

export type State = { ok?: boolean; message?: string; fields?: Record<string, string[]> };

export async function changeRoleAction(userId: number, _prev: State, formData: FormData): Promise<State> {
  const actor = await requireRole('admin');
  const parsed = RoleChangeSchema.safeParse({ userId, roles: formData.getAll('roles') });
  if (!parsed.success) return { message: 'Please choose at least one role.', fields: fieldErrors(parsed.error) };
  try {
    await changeRoles(actor.id, parsed.data);
  } catch (error) {
    if (error instanceof AppError) return { message: error.message };
    throw error;
  }
  revalidatePath('/admin/users');
  return { ok: true, message: 'Roles saved.' };
}
