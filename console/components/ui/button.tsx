import type { ButtonHTMLAttributes } from 'react';
import { cn } from '@console/utils/cn';
import { Spinner } from './spinner';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'ghost' | 'ghost-danger';
export type ButtonSize = 'sm' | 'md';

const variantClasses: Record<ButtonVariant, string> = {
  primary: 'bg-ink-700 text-white hover:bg-ink-800 active:bg-ink-900 border border-ink-700',
  secondary: 'bg-surface text-ink-800 border border-ink-400 hover:bg-ink-50 hover:border-ink-500',
  danger: 'bg-danger-700 text-white border border-danger-700 hover:bg-danger-600',
  ghost: 'bg-transparent text-ink-700 border border-transparent hover:bg-ink-100',
  'ghost-danger': 'bg-transparent text-danger-700 border border-transparent hover:bg-danger-50',
};

const sizeClasses: Record<ButtonSize, string> = {
  sm: 'h-8 px-3 text-sm gap-1.5',
  md: 'h-10 px-4 text-sm gap-2',
};

export function buttonClasses(variant: ButtonVariant = 'primary', size: ButtonSize = 'md', className?: string) {
  return cn(
    'inline-flex items-center justify-center rounded-md font-semibold whitespace-nowrap transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-55',
    variantClasses[variant],
    sizeClasses[size],
    className,
  );
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner and blocks repeat clicks while the request runs. */
  isPending?: boolean;
};

export function Button({ variant, size, isPending, className, disabled, children, type, ...rest }: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || isPending}
      aria-busy={isPending || undefined}
      {...rest}
    >
      {isPending && <Spinner />}
      {children}
    </button>
  );
}
