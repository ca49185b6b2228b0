'use server';

import { revalidatePath } from 'next/cache';
import { requireRole } from '@/lib/auth/guard';
import { AppError, fieldErrors } from '@/lib/errors';
import { saveProgramSettings } from '@/lib/program/settings';
import { ProgramSettingsSchema } from '@/lib/validations/program';

export type State = { ok?: boolean; message?: string; fields?: Record<string, string[]> };

export async function saveProgramAction(_prev: State, formData: FormData): Promise<State> {
  const actor = await requireRole('admin');
  const text = (key: string) => {
    const value = formData.get(key);
    return typeof value === 'string' ? value : undefined;
  };
  const parsed = ProgramSettingsSchema.safeParse({
    name: text('name'),
    shortName: text('shortName'),
    contactEmail: text('contactEmail'),
    contactPhone: text('contactPhone'),
    postalAddress: text('postalAddress'),
    timeZone: text('timeZone'),
  });
  if (!parsed.success) return { message: 'Please check the fields marked below.', fields: fieldErrors(parsed.error) };
  const logo = formData.get('logo');
  const logoBytes = logo && typeof logo !== 'string' && logo.size > 0 ? Buffer.from(await logo.arrayBuffer()) : null;
  try {
    await saveProgramSettings(actor.id, parsed.data, logoBytes);
  } catch (error) {
    if (error instanceof AppError) return { message: error.message, fields: error.fields };
    throw error;
  }
  revalidatePath('/admin/program');
  return { ok: true, message: 'Program settings saved.' };
}
