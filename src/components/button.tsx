import type { ButtonHTMLAttributes, ReactNode, Ref } from 'react';
import { SpinnerIcon } from './icons';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';
export type ButtonSize = 'sm' | 'md';

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner, marks the button busy and blocks further clicks. */
  busy?: boolean;
  icon?: ReactNode;
  ref?: Ref<HTMLButtonElement>;
}

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-brass text-ink-900 border-brass-deep hover:bg-[#c29d4a] active:bg-[#a17f31]',
  secondary: 'bg-card text-ink-900 border-paper-line hover:bg-paper-deep',
  quiet: 'bg-transparent text-ink-800 border-transparent hover:bg-paper-deep',
  danger: 'bg-card text-bad border-bad/50 hover:bg-bad-wash',
};

const sizes: Record<ButtonSize, string> = {
  sm: 'min-h-8 px-2.5 text-sm gap-1.5',
  md: 'min-h-10 px-4 text-base gap-2',
};

export function buttonClasses(variant: ButtonVariant = 'secondary', size: ButtonSize = 'md', extra = ''): string {
  return [
    'inline-flex items-center justify-center rounded-md border font-semibold leading-tight',
    'transition-colors disabled:cursor-not-allowed disabled:opacity-55',
    variants[variant],
    sizes[size],
    extra,
  ].join(' ');
}

export function Button({ variant = 'secondary', size = 'md', busy = false, icon, type = 'button', disabled, className = '', children, ...rest }: ButtonProps) {
  return (
    <button type={type} disabled={disabled || busy} aria-busy={busy || undefined} className={buttonClasses(variant, size, className)} {...rest}>
      {busy ? <SpinnerIcon size={size === 'sm' ? 14 : 16} /> : icon}
      {children}
    </button>
  );
}
