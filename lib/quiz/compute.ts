import { boilingPoint, brineAcidity, convert, headspaceCheck, pressureForAltitude, processingTime, saltForBrine } from '@/lib/preserving';
import type { ComputeFns } from './resolve';
import type { ComputeName } from './schema';

// The lib/preserving functions a numeric question may name in its "compute" field.
export const COMPUTE_FNS: Record<ComputeName, ComputeFns[string]> = {
  processingTime,
  pressureForAltitude,
  boilingPoint,
  headspaceCheck,
  saltForBrine,
  brineAcidity,
  convert,
} as unknown as Record<ComputeName, ComputeFns[string]>;

/** Converts a numeric answer to the unit the question asks for (same unit: unchanged). */
export function convertUnits(value: number, from: string, to: string): number {
  if (from === to) return value;
  return convert(value, from as Parameters<typeof convert>[1], to as Parameters<typeof convert>[2]);
}
