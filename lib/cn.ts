import { clsx, type ClassValue } from 'clsx';
import { twMerge } from 'tailwind-merge';

/**
 * Class names joined, with a later Tailwind class winning over an earlier one of the same property
 * (`cn('whitespace-nowrap', 'whitespace-normal')` is `whitespace-normal`), so a component's default
 * can be overridden by its caller whatever order the stylesheet happens to put the two in.
 */
export const cn = (...values: ClassValue[]) => twMerge(clsx(values));
