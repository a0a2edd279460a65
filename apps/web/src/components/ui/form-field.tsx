import { createContext, use, useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { Icon } from './icon';

type FieldContextValue = { id: string; describedBy: string | undefined; isInvalid: boolean };
const FieldContext = createContext<FieldContextValue | null>(null);

/** Reads the surrounding FormField, so inputs get their id, description and invalid state without wiring. */
function useField(): FieldContextValue | null {
  return use(FieldContext);
}

/**
 * A labelled field: label, optional hint, the control, and the error under it. The error is linked to
 * the control with aria-describedby and announced as it appears.
 */
export function FormField({
  label,
  hint,
  error,
  children,
  className,
  isOptional = false,
}: {
  label: ReactNode;
  hint?: ReactNode;
  error?: string | undefined;
  children: ReactNode;
  className?: string;
  isOptional?: boolean;
}) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
  return (
    <FieldContext value={{ id, describedBy, isInvalid: Boolean(error) }}>
      <div className={cn('flex flex-col gap-1.5', className)}>
        <label htmlFor={id} className="font-semibold text-ink">
          {label}
          {isOptional ? <span className="ml-1 font-normal text-ink-faint">(optional)</span> : null}
        </label>
        {hint ? (
          <p id={hintId} className="text-sm text-ink-muted">
            {hint}
          </p>
        ) : null}
        {children}
        <div aria-live="polite">
          {error ? <FieldError id={errorId} message={error} /> : null}
        </div>
      </div>
    </FieldContext>
  );
}

/** A field's error under it: the fail icon with the words, so it does not rest on colour alone. */
export function FieldError({ id, message }: { id: string; message: string }) {
  return (
    <p id={id} className="flex items-start gap-1.5 text-base font-medium text-fail">
      <Icon name="fail" className="mt-0.5 size-5" />
      <span>{message}</span>
    </p>
  );
}

const controlClasses = cn(
  'min-h-touch w-full rounded-control border-2 border-edge bg-surface px-3 text-base text-ink',
  'placeholder:text-ink-faint hover:border-ink-muted',
  'aria-invalid:border-fail aria-invalid:bg-fail-soft/40',
  'disabled:cursor-not-allowed disabled:bg-sunken disabled:text-ink-muted',
);

export function Input({ className, id, ...props }: ComponentProps<'input'>) {
  const field = useField();
  return (
    <input
      id={id ?? field?.id}
      aria-describedby={field?.describedBy}
      aria-invalid={field?.isInvalid || undefined}
      className={cn(controlClasses, className)}
      {...props}
    />
  );
}

export function Select({ className, id, children, ...props }: ComponentProps<'select'>) {
  const field = useField();
  return (
    <div className="relative">
      <select
        id={id ?? field?.id}
        aria-describedby={field?.describedBy}
        aria-invalid={field?.isInvalid || undefined}
        className={cn(controlClasses, 'appearance-none pr-9', className)}
        {...props}
      >
        {children}
      </select>
      <Icon name="chevronDown" className="pointer-events-none absolute top-1/2 right-2.5 -translate-y-1/2 text-ink-muted" />
    </div>
  );
}

export function Textarea({ className, id, rows = 3, ...props }: ComponentProps<'textarea'>) {
  const field = useField();
  return (
    <textarea
      id={id ?? field?.id}
      rows={rows}
      aria-describedby={field?.describedBy}
      aria-invalid={field?.isInvalid || undefined}
      className={cn(controlClasses, 'py-2.5 leading-normal', className)}
      {...props}
    />
  );
}
