import { cn } from '@/lib/cn';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';

const base =
  'inline-flex min-h-11 min-w-11 items-center justify-center gap-2 rounded-lg px-5 py-2 text-base font-bold ' +
  'no-underline motion-safe:transition-colors disabled:cursor-not-allowed disabled:border-field-border disabled:bg-paper-deep disabled:text-ink-soft';

const variants: Record<ButtonVariant, string> = {
  primary: 'border-2 border-ink bg-saffron text-ink enabled:hover:bg-[#f7c25a]',
  secondary: 'border-2 border-ink bg-surface text-ink enabled:hover:bg-paper-deep',
  danger: 'border-2 border-danger bg-danger text-surface enabled:hover:bg-[#7f1b1f]',
  quiet: 'border-2 border-transparent bg-transparent text-ink underline hover:bg-paper-deep',
};

/** Class names for anything that should look like a button (links included). */
export const buttonClasses = (variant: ButtonVariant = 'secondary', className?: string): string =>
  cn(base, variants[variant], className);
