import type { MdxComponents } from '@/lib/content/mdx';
import * as calculators from './calculators';
import { Caution, KeyPoint, proseElements, Source } from './prose';

export { Caution, KeyPoint, Source } from './prose';

/**
 * The one component map for course content: every markdown element styled, internal links
 * through next/link, the prose helpers, and the calculators. The calculators come through
 * ./calculators, which loads each one on demand, so a lesson ships only the ones it embeds.
 */
export const mdxComponents: MdxComponents = {
  ...proseElements,
  Caution,
  KeyPoint,
  Source,
  ...calculators,
};
