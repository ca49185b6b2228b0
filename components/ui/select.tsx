import { useId, type ComponentProps } from 'react';
import { cn } from '@/lib/cn';
import { FieldError, fieldClasses } from './text-field';

type Option = { value: string; label: string };
type SelectProps = ComponentProps<'select'> & { label: string; options: readonly Option[]; hint?: string; error?: string };

export function Select({ label, options, hint, error, id, className, ...rest }: SelectProps) {
  const autoId = useId();
  const selectId = id ?? autoId;
  const hintId = hint ? `${selectId}-hint` : undefined;
  const errorId = error ? `${selectId}-error` : undefined;
  return (
    <div className={cn('space-y-1', className)}>
      <label htmlFor={selectId} className="block text-sm font-semibold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      <select
        id={selectId}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={cn(fieldClasses, 'pr-8', error ? 'border-beet-500' : 'border-ink-faint/40')}
        {...rest}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      <FieldError id={errorId} message={error} />
    </div>
  );
}
