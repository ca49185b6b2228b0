import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { WarningIcon } from './warning-icon';

type TextFieldProps = ComponentProps<'input'> & {
  label: string;
  hint?: string;
  error?: string;
  /** Shown after the input, e.g. a unit such as "mL". */
  suffix?: string;
};

export const fieldClasses =
  'block w-full rounded-lg border bg-white px-3 py-2 text-ink shadow-inner placeholder:text-ink-faint focus:border-brine-600 focus:outline-2 focus:outline-offset-0 focus:outline-brine-300 disabled:bg-paper-deep';

/** The label, hint and error around a field, with the ids that tie them to it for screen readers. */
function Field({
  label,
  hint,
  error,
  id,
  className,
  children,
}: {
  label: string;
  hint?: string;
  error?: string;
  id?: string;
  className?: string;
  children: (aria: FieldAria) => ReactNode;
}) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  return (
    <div className={cn('space-y-1', className)}>
      <label htmlFor={inputId} className="block text-sm font-semibold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      {children({
        id: inputId,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': [hintId, errorId].filter(Boolean).join(' ') || undefined,
        className: cn(fieldClasses, error ? 'border-beet-500' : 'border-ink-faint/40'),
      })}
      <FieldError id={errorId} message={error} />
    </div>
  );
}

type FieldAria = { id: string; 'aria-invalid': true | undefined; 'aria-describedby': string | undefined; className: string };

/** A labelled input whose hint and error are tied to it for screen readers. */
export function TextField({ label, hint, error, suffix, id, className, ...rest }: TextFieldProps) {
  return (
    <Field label={label} hint={hint} error={error} id={id} className={className}>
      {(aria) => (
        <div className="flex items-center gap-2">
          <input {...aria} {...rest} />
          {suffix ? <span className="shrink-0 text-sm text-ink-soft">{suffix}</span> : null}
        </div>
      )}
    </Field>
  );
}

type TextAreaProps = ComponentProps<'textarea'> & { label: string; hint?: string; error?: string };

/** A labelled multi-line field, tied to its hint and error like TextField. */
export function TextArea({ label, hint, error, id, className, rows = 4, ...rest }: TextAreaProps) {
  return (
    <Field label={label} hint={hint} error={error} id={id} className={className}>
      {(aria) => <textarea rows={rows} {...aria} {...rest} />}
    </Field>
  );
}

export function FieldError({ id, message }: { id?: string; message?: string }) {
  return (
    <p id={id} className="min-h-0 text-sm font-medium text-beet-600" aria-live="polite">
      {message ? (
        <>
          <WarningIcon />
          {message}
        </>
      ) : null}
    </p>
  );
}
