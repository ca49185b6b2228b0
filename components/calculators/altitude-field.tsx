'use client';

import { Select } from '@/components/ui/select';
import { TextField } from '@/components/ui/text-field';
import { RULES } from '@/lib/preserving/errors';
import type { AltitudeUnit } from '@/lib/preserving/units';
import { fmt, type Reader } from './parts';

const UNIT_OPTIONS = [
  { value: 'ft', label: 'feet' },
  { value: 'm', label: 'metres' },
];
const M_PER_FT = 0.3048; // exact (NIST Handbook 44, Appendix C)

/** Field names an altitude error may come under, for calculate()'s list. */
export const ALTITUDE_FIELDS = ['altitudeFt', 'altitudeM'] as const;

/** The typed altitude in feet, whichever unit it was typed in; a bad value is noted under its unit's name. */
export function readAltitudeFt(read: Reader, value: string, unit: AltitudeUnit): number {
  return unit === 'm' ? read.num(value, RULES.altitudeM) / M_PER_FT : read.num(value, RULES.altitudeFt);
}

/** Altitude in feet or metres, with the other unit shown beside it; below sea level is negative and uses the lowest band. */
export function AltitudeField({
  value,
  onChange,
  unit = 'ft',
  onUnitChange,
  error,
}: {
  value: string;
  onChange: (value: string) => void;
  unit?: AltitudeUnit;
  onUnitChange?: (unit: AltitudeUnit) => void;
  error?: string;
}) {
  const typed = Number(value.replace(/,/g, ''));
  const known = value.trim() !== '' && Number.isFinite(typed);
  const below = known && typed < 0 ? ' (below sea level: the lowest band applies)' : '';
  const hint = !known
    ? 'Above sea level; 1 m = 3.28 ft, 1 ft = 0.3048 m'
    : unit === 'm'
      ? `= ${fmt(typed / M_PER_FT, 0)} ft${below}`
      : `= ${fmt(typed * M_PER_FT, 0)} m${below}`;
  return (
    <>
      <TextField
        label="Altitude"
        suffix={unit}
        inputMode="decimal"
        autoComplete="off"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        error={error}
        hint={hint}
      />
      {onUnitChange ? (
        <Select label="Altitude in" options={UNIT_OPTIONS} value={unit} onChange={(event) => onUnitChange(event.target.value as AltitudeUnit)} />
      ) : null}
    </>
  );
}
