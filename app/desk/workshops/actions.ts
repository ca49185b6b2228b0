'use server';

import { revalidatePath } from 'next/cache';
import { requireRole } from '@/lib/auth/guard';
import { saveWorkshop } from '@/lib/enrollment/admin';
import { AppError, fieldErrors } from '@/lib/errors';
import { WorkshopSchema, type WorkshopInput } from '@/lib/validations/workshop';

export type SaveState = { ok: true; id: number } | { ok: false; message: string; fields?: Record<string, string[]> };

/** Creates (id null) or edits a workshop; the same zod schema as the form. */
export async function saveWorkshopAction(id: number | null, input: WorkshopInput): Promise<SaveState> {
  const user = await requireRole('coordinator');
  const parsed = WorkshopSchema.safeParse(input);
  if (!parsed.success) return { ok: false, message: 'Please check the highlighted fields.', fields: fieldErrors(parsed.error) };
  try {
    const saved = await saveWorkshop({ id: id ?? undefined, values: parsed.data, actorId: user.id });
    revalidatePath('/desk/workshops');
    return { ok: true, id: saved };
  } catch (error) {
    if (error instanceof AppError && error.status < 500) return { ok: false, message: error.message, fields: error.fields };
    throw error;
  }
}
