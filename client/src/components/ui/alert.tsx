import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

export type AlertTone = 'error' | 'success' | 'info';

const tones: Record<AlertTone, { box: string; label: string; icon: ReactNode }> = {
  error: {
    box: 'border-danger bg-danger-light',
    label: 'Problem',
    icon: <path d="M10 1.5 19 18H1L10 1.5Zm-1 6v5h2v-5H9Zm0 6.5v2h2v-2H9Z" />,
  },
  success: {
    box: 'border-success bg-success-light',
    label: 'Done',
    icon: <path d="M7.5 13.6 3.9 10l-1.4 1.4 5 5 10-10-1.4-1.4-8.6 8.6Z" />,
  },
  info: {
    box: 'border-ink bg-saffron-light',
    label: 'Note',
    icon: <path d="M10 1a9 9 0 1 0 0 18 9 9 0 0 0 0-18Zm1 14H9V9h2v6Zm0-8H9V5h2v2Z" />,
  },
};

type AlertProps = { tone: AlertTone; title?: string; children: ReactNode; className?: string };

/**
 * A boxed message. It carries no live role itself: put it inside a role="alert" or
 * role="status" region that is already on the page, so the change is announced.
 */
export const Alert = ({ tone, title, children, className }: AlertProps) => {
  const { box, label, icon } = tones[tone];
  return (
    <div className={cn('flex gap-3 rounded-lg border-l-8 border-2 p-4 text-ink', box, className)}>
      <svg aria-hidden="true" viewBox="0 0 20 20" className="mt-1 size-5 shrink-0 fill-current">
        {icon}
      </svg>
      <div className="min-w-0">
        <p className="font-bold">
          <span className="sr-only">{label}: </span>
          {title}
        </p>
        <div className={cn(title && 'mt-1')}>{children}</div>
      </div>
    </div>
  );
};
