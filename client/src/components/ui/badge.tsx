import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

export type BadgeTone = 'good' | 'warn' | 'bad' | 'neutral';

const tones: Record<BadgeTone, { box: string; dot: string }> = {
  good: { box: 'border-success bg-success-light text-success', dot: 'bg-success' },
  warn: { box: 'border-rust bg-saffron-light text-rust', dot: 'bg-rust' },
  bad: { box: 'border-danger bg-danger-light text-danger', dot: 'bg-danger' },
  neutral: { box: 'border-field-border bg-paper-deep text-ink-soft', dot: 'bg-ink-soft' },
};

/** A short status in words with a coloured frame (the words carry the meaning, not the colour). */
export const Badge = ({
  tone,
  children,
  className,
}: {
  tone: BadgeTone;
  children: ReactNode;
  className?: string;
}) => (
  <span
    className={cn(
      'inline-flex w-fit items-center gap-2 rounded-full border-2 px-3 py-0.5 font-bold',
      tones[tone].box,
      className,
    )}
  >
    <span aria-hidden="true" className={cn('size-2.5 shrink-0 rounded-full', tones[tone].dot)} />
    {children}
  </span>
);
