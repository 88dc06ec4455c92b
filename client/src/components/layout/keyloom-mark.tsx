import { cn } from '@/lib/cn';

/**
 * Keyloom's mark: three warp threads crossed by two weft threads that dip over and under
 * them, the way a personal vocabulary is woven into a general one. Decorative only.
 */
export const KeyloomMark = ({ className }: { className?: string }) => (
  <svg aria-hidden="true" focusable="false" viewBox="0 0 40 40" className={cn('size-10 shrink-0', className)}>
    <rect x="1" y="1" width="38" height="38" rx="9" fill="#f5b335" />
    <g stroke="#1d2b4f" strokeLinecap="round" fill="none">
      <path d="M12 7v26M20 7v26M28 7v26" strokeWidth="3" />
      <path d="M6 15c3 0 3 3 6 3s3-3 8-3 5 3 8 3 3-3 6-3" strokeWidth="3.2" stroke="#fbf8f1" />
      <path d="M6 15c3 0 3 3 6 3s3-3 8-3 5 3 8 3 3-3 6-3" strokeWidth="1.6" />
      <path d="M6 25c3 0 3-3 6-3s3 3 8 3 5-3 8-3 3 3 6 3" strokeWidth="3.2" stroke="#fbf8f1" />
      <path d="M6 25c3 0 3-3 6-3s3 3 8 3 5-3 8-3 3 3 6 3" strokeWidth="1.6" />
    </g>
  </svg>
);
