'use client';

import { TextField } from '@/components/ui/text-field';
import { fmt } from './parts';

/** Altitude in feet, with the metres shown beside it (1 ft = 0.3048 m exactly). */
export function AltitudeField({ value, onChange, error }: { value: string; onChange: (value: string) => void; error?: string }) {
  const feet = Number(value.replace(/,/g, ''));
  const hint = value.trim() !== '' && Number.isFinite(feet) && feet >= 0 ? `= ${fmt(feet * 0.3048, 0)} m above sea level` : 'Feet above sea level; 1 m = 3.28 ft';
  return <TextField label="Altitude" suffix="ft" inputMode="decimal" autoComplete="off" value={value} onChange={(event) => onChange(event.target.value)} error={error} hint={hint} />;
}
