// The component names a lesson may use in its MDX (the shared contract in the project brief).
// components/mdx/index.tsx provides exactly these; the content test checks every lesson against them.
export const CALCULATOR_NAMES = [
  'BrineCalculator',
  'SaltCalculator',
  'SugarCalculator',
  'HeadspaceCalculator',
  'ProcessingTimeCalculator',
  'PressureCalculator',
  'BoilingPointCalculator',
  'CrispingCalculator',
  'BatchPlanner',
  'UnitConverter',
] as const;

export const PROSE_HELPER_NAMES = ['Caution', 'KeyPoint', 'Source'] as const;

export type CalculatorName = (typeof CALCULATOR_NAMES)[number];
export const MDX_COMPONENT_NAMES: readonly string[] = [...CALCULATOR_NAMES, ...PROSE_HELPER_NAMES];

/** The capitalised JSX tags an MDX body uses, in order of first use. */
export function componentsUsed(body: string): string[] {
  const names = new Set<string>();
  for (const match of body.replace(/```[\s\S]*?```/g, '').matchAll(/<([A-Z][A-Za-z0-9]*)\b/g)) names.add(match[1]);
  return [...names];
}
