import type { ComponentPropsWithoutRef, ReactNode, Ref } from 'react';
import { useId } from 'react';
import { cn } from '@/lib/cn';

// Below the md breakpoint each row becomes a card: cells stack and show their column name.
// Explicit roles keep the table semantics that `display: block` would otherwise drop.

type TableProps = {
  caption: ReactNode;
  children: ReactNode;
  className?: string;
  /**
   * The region scrolls sideways on its own when the table is wider than the page, and takes
   * keyboard focus so it can be scrolled without a mouse (and focus can be moved to it).
   */
  scrollable?: boolean;
  ref?: Ref<HTMLDivElement>;
};

/** A data table with a caption, inside a labelled region that can scroll on its own. */
export const Table = ({ caption, children, className, scrollable = false, ref }: TableProps) => {
  const captionId = useId();
  return (
    <div
      ref={ref}
      role="region"
      aria-labelledby={captionId}
      tabIndex={scrollable ? 0 : undefined}
      className={cn('w-full', scrollable && 'overflow-x-auto', className)}
    >
      <table role="table" className="w-full border-collapse text-left max-md:block">
        <caption id={captionId} className="mb-3 text-left text-lg font-bold max-md:block">
          {caption}
        </caption>
        {children}
      </table>
    </div>
  );
};

export const TableHead = ({ children }: { children: ReactNode }) => (
  <thead role="rowgroup" className="max-md:sr-only">
    <tr role="row" className="border-b-2 border-ink">
      {children}
    </tr>
  </thead>
);

export const TableBody = ({ children }: { children: ReactNode }) => (
  <tbody role="rowgroup" className="max-md:flex max-md:flex-col max-md:gap-4">
    {children}
  </tbody>
);

export const ColumnHeader = ({ children, className }: { children: ReactNode; className?: string }) => (
  <th role="columnheader" scope="col" className={cn('px-3 py-3 align-bottom font-bold', className)}>
    {children}
  </th>
);

export const TableRow = ({ children, className }: { children: ReactNode; className?: string }) => (
  <tr
    role="row"
    className={cn(
      'border-b border-thread align-top',
      'max-md:flex max-md:flex-col max-md:gap-1 max-md:rounded-xl max-md:border-2 max-md:border-thread max-md:bg-surface max-md:p-4',
      className,
    )}
  >
    {children}
  </tr>
);

type CellProps = Omit<ComponentPropsWithoutRef<'td'>, 'children'> & {
  /** The column name, shown above the value when rows are cards. */
  label: string;
  children: ReactNode;
};

const cellClasses = 'px-3 py-3 max-md:flex max-md:flex-col max-md:px-0 max-md:py-1';

const CardLabel = ({ label }: { label: string }) => (
  <span aria-hidden="true" className="text-sm font-bold text-ink-soft uppercase md:hidden">
    {label}
  </span>
);

export const TableCell = ({ label, children, className, ...props }: CellProps) => (
  <td role="cell" className={cn(cellClasses, className)} {...props}>
    <CardLabel label={label} />
    {children}
  </td>
);

/** The cell that names the row (e.g. the person), announced as the row's header. */
export const RowHeader = ({ label, children, className }: CellProps) => (
  <th role="rowheader" scope="row" className={cn(cellClasses, 'font-bold', className)}>
    <CardLabel label={label} />
    {children}
  </th>
);

export type SortDirection = 'ascending' | 'descending';

type SortableColumnHeaderProps = {
  children: ReactNode;
  /** This column's direction when the table is sorted by it; null when sorted by another. */
  direction: SortDirection | null;
  onSort: () => void;
  className?: string;
};

/** A column header whose button sorts the table; aria-sort tells screen readers the order. */
export const SortableColumnHeader = ({
  children,
  direction,
  onSort,
  className,
}: SortableColumnHeaderProps) => (
  <th
    role="columnheader"
    scope="col"
    aria-sort={direction ?? 'none'}
    className={cn('px-1 py-2 align-bottom font-bold', className)}
  >
    <button
      type="button"
      onClick={onSort}
      className="inline-flex min-h-11 items-center gap-2 rounded-lg px-2 text-left font-bold hover:bg-paper-deep"
    >
      {children}
      <svg aria-hidden="true" viewBox="0 0 12 16" className="size-3 shrink-0 fill-current">
        {direction !== 'descending' && <path d="M6 1 11 7H1Z" opacity={direction ? 1 : 0.35} />}
        {direction !== 'ascending' && <path d="M6 15 1 9h10Z" opacity={direction ? 1 : 0.35} />}
      </svg>
    </button>
  </th>
);
