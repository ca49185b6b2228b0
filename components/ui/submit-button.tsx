'use client';

import { Button, type ButtonProps } from './button';
import { useHydrated } from './use-hydrated';

/**
 * The submit button of a form whose submit is handled in the browser. It stays disabled until the
 * page has hydrated, so neither a click nor Enter (the HTML spec skips implicit submission when the
 * default button is disabled) can send the form as a plain GET with its fields in the address,
 * a password among them, before the handler is attached.
 */
export function SubmitButton({ disabled, ...rest }: Omit<ButtonProps, 'type'>) {
  const hydrated = useHydrated();
  return <Button type="submit" disabled={disabled || !hydrated} {...rest} />;
}
