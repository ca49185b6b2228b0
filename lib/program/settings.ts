import 'server-only';
import { createHash } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { getStorage } from '@/lib/storage';
import type { ProgramSettingsInput } from '@/lib/validations/program';
import { db } from '@/models';
import { processLogo } from './logo';

export type ProgramIdentity = {
  name: string;
  shortName: string | null;
  contactEmail: string | null;
  contactPhone: string | null;
  postalAddress: string | null;
  timeZone: string;
  logoKey: string | null;
  /** False until an admin saves the program page: the name is then CERTIFICATE_PROGRAM_NAME. */
  configured: boolean;
};

const ROW_ID = 1;
export const DEFAULT_TIME_ZONE = 'America/Denver';

/** The program's identity, or the fallback from CERTIFICATE_PROGRAM_NAME when the page was never saved. */
export async function getProgramIdentity(options: { transaction?: Transaction } = {}): Promise<ProgramIdentity> {
  const row = await db().ProgramSetting.findByPk(ROW_ID, { raw: true, transaction: options.transaction });
  if (!row)
    return {
      name: getEnv().CERTIFICATE_PROGRAM_NAME,
      shortName: null,
      contactEmail: null,
      contactPhone: null,
      postalAddress: null,
      timeZone: DEFAULT_TIME_ZONE,
      logoKey: null,
      configured: false,
    };
  return {
    name: row.name,
    shortName: row.shortName,
    contactEmail: row.contactEmail,
    contactPhone: row.contactPhone,
    postalAddress: row.postalAddress,
    timeZone: row.timeZone,
    logoKey: row.logoKey ?? null,
    configured: true,
  };
}

/** Saves the program page; the change is audited with what changed. */
export async function saveProgramSettings(actorId: number, input: ProgramSettingsInput): Promise<void> {
  const { ProgramSetting, sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    const row = await ProgramSetting.findByPk(ROW_ID, { transaction, lock: transaction.LOCK.UPDATE });
    const next = { ...input, updatedById: actorId };
    const changed = Object.keys(input).filter((k) => !row || row.get(k as keyof ProgramSettingsInput) !== input[k as keyof ProgramSettingsInput]);
    if (row) await row.update(next, { transaction });
    else await ProgramSetting.create({ id: ROW_ID, ...next }, { transaction });
    await audit({ actorId, action: 'program.settings_saved', subjectType: 'program', subjectId: ROW_ID, data: { changed } }, { transaction });
  });
}

/** Re-encodes and stores a new logo for a program whose page was saved (409 before that: the row holds the name). */
export async function saveProgramLogo(actorId: number, logo: Buffer): Promise<{ logoKey: string }> {
  const { ProgramSetting, sequelize } = db();
  if (!(await ProgramSetting.count({ where: { id: ROW_ID } })))
    throw new AppError('conflict', 'Save the program’s name first, then add the logo.', { fields: { logo: ['Save the program’s name first.'] } });
  const png = await processLogo(logo);
  // A new key per image, so browsers and proxies never show an old logo under a cached address.
  const logoKey = `program/logo-${createHash('sha256').update(png).digest('hex').slice(0, 20)}.png`;
  await getStorage().put(logoKey, png, 'image/png');
  await sequelize.transaction(async (transaction) => {
    await ProgramSetting.update({ logoKey, updatedById: actorId }, { where: { id: ROW_ID }, transaction });
    await audit({ actorId, action: 'program.logo_saved', subjectType: 'program', subjectId: ROW_ID, data: { logo: logoKey } }, { transaction });
  });
  return { logoKey };
}

/** The logo's bytes from the storage driver, or null when none was uploaded. */
export async function readProgramLogo(): Promise<{ data: Buffer; contentType: string } | null> {
  const { logoKey } = await getProgramIdentity();
  return logoKey ? getStorage().get(logoKey) : null;
}
