import type { ComponentProps } from 'react';
import { Link } from 'react-router';
import { cn } from '@/lib/cn';
import { Spinner } from './spinner';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger' | 'brand';
type Size = 'md' | 'lg';

const variantClasses: Record<Variant, string> = {
  primary: 'bg-copper text-white hover:bg-copper-strong active:bg-copper-strong shadow-card',
  brand: 'bg-brand text-on-brand hover:bg-brand-strong active:bg-brand-strong shadow-card',
  secondary: 'bg-surface text-ink border-2 border-edge hover:bg-sunken active:bg-sunken',
  ghost: 'bg-transparent text-ink hover:bg-sunken active:bg-sunken',
  danger: 'bg-fail text-white hover:bg-fail-strong active:bg-fail-strong shadow-card',
};

/* Every size keeps a 48 px touch target; `lg` is for the one main action on a phone screen. */
const sizeClasses: Record<Size, string> = {
  md: 'min-h-touch px-4 text-base',
  lg: 'min-h-14 px-6 text-lg',
};

/** The classes of a button, for links that should look like one. */
export function buttonClasses(options: { variant?: Variant; size?: Size; isFullWidth?: boolean; className?: string } = {}) {
  const { variant = 'secondary', size = 'md', isFullWidth = false, className } = options;
  return cn(
    'inline-flex items-center justify-center gap-2 rounded-control font-semibold leading-tight select-none',
    'transition-colors duration-150 disabled:cursor-not-allowed disabled:opacity-60',
    'aria-disabled:cursor-not-allowed aria-disabled:opacity-60',
    variantClasses[variant],
    sizeClasses[size],
    isFullWidth && 'w-full',
    className,
  );
}

type ButtonProps = ComponentProps<'button'> & {
  variant?: Variant;
  size?: Size;
  isFullWidth?: boolean;
  /** Shows a spinner, keeps the label for screen readers and blocks a second press. */
  isPending?: boolean;
};

export function Button({
  variant,
  size,
  isFullWidth,
  isPending = false,
  className,
  children,
  disabled,
  type = 'button',
  ...props
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses({ variant, size, isFullWidth, className })}
      disabled={disabled ?? isPending}
      aria-busy={isPending || undefined}
      {...props}
    >
      {isPending ? <Spinner className="size-5" /> : null}
      {children}
    </button>
  );
}

type ButtonLinkProps = ComponentProps<typeof Link> & { variant?: Variant; size?: Size; isFullWidth?: boolean };

export function ButtonLink({ variant, size, isFullWidth, className, ...props }: ButtonLinkProps) {
  return <Link className={buttonClasses({ variant, size, isFullWidth, className })} {...props} />;
}
