import { checkNumber, RULES } from './errors';
import { getProduct } from './products';

export type HeadspaceVerdict = 'too-little' | 'ok' | 'too-much';
export type HeadspaceResult = {
  recommendedIn: number;
  source: string;
  verdict?: HeadspaceVerdict;
  why?: string;
  toleranceIn?: number;
  toleranceSource?: string;
};

/** How far from the recipe's headspace still counts as right: 1/8 inch, the finest mark on a
 * common headspace tool (common practice, no published tolerance). */
export const HEADSPACE_TOLERANCE_IN = 0.125;
export const HEADSPACE_TOLERANCE_SOURCE = 'common practice (the finest mark on a common headspace tool); no published tolerance';

const WHY: Record<HeadspaceVerdict, string> = {
  'too-little': 'Too little headspace: food and liquid can bubble out while the jar is processed, and food left on the rim can keep the lid from sealing.',
  ok: 'This matches the headspace the tested recipe gives, within 1/8 inch (a common-practice tolerance, not a published one): room for the contents to expand and for air to be driven out so a vacuum seal forms.',
  'too-much': 'Too much headspace: processing may not drive all the air out of the jar, so the lid may not seal, and food at the top can darken.',
};

/** The recommended headspace of a product's tested recipe, and a verdict on a measured one. */
export function headspaceCheck({ product, measuredIn }: { product: string; measuredIn?: number }): HeadspaceResult {
  const found = getProduct(product);
  const result: HeadspaceResult = { recommendedIn: found.headspaceIn, source: found.source };
  if (measuredIn === undefined) return result;
  const measured = checkNumber(measuredIn, RULES.measuredIn);
  const verdict: HeadspaceVerdict =
    measured < found.headspaceIn - HEADSPACE_TOLERANCE_IN - 1e-9
      ? 'too-little'
      : measured > found.headspaceIn + HEADSPACE_TOLERANCE_IN + 1e-9
        ? 'too-much'
        : 'ok';
  return { ...result, verdict, why: WHY[verdict], toleranceIn: HEADSPACE_TOLERANCE_IN, toleranceSource: HEADSPACE_TOLERANCE_SOURCE };
}
