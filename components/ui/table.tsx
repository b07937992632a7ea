import type { ComponentPropsWithoutRef, ReactNode } from 'react';
import { cx } from './cx';

export type TableProps = ComponentPropsWithoutRef<'table'> & {
  /** Shown above the table and used as its accessible name. */
  caption?: ReactNode;
  /** Hide the caption visually but keep it for screen readers. */
  captionHidden?: boolean;
  dense?: boolean;
};

/**
 * A plain semantic table for short lists (limits, readings, invoice lines). Long or filterable lists
 * belong in DataGrid. Wide tables scroll sideways inside their own box, not the page.
 */
export function Table({ caption, captionHidden, dense, className, children, ...rest }: TableProps) {
  return (
    <div className="overflow-x-auto">
      <table
        data-dense={dense || undefined}
        className={cx('w-full border-collapse text-left text-sm tabular', className)}
        {...rest}
      >
        {caption ? (
          <caption className={cx('pb-2 text-left text-sm font-semibold text-ink', captionHidden && 'sr-only')}>
            {caption}
          </caption>
        ) : null}
        {children}
      </table>
    </div>
  );
}

export function THead({ className, ...rest }: ComponentPropsWithoutRef<'thead'>) {
  return <thead className={cx('border-b border-surface-line bg-surface-muted', className)} {...rest} />;
}

export function TBody({ className, ...rest }: ComponentPropsWithoutRef<'tbody'>) {
  return <tbody className={cx('divide-y divide-surface-line', className)} {...rest} />;
}

export function TFoot({ className, ...rest }: ComponentPropsWithoutRef<'tfoot'>) {
  return <tfoot className={cx('border-t-2 border-surface-line font-semibold', className)} {...rest} />;
}

export function Tr({ className, ...rest }: ComponentPropsWithoutRef<'tr'>) {
  return <tr className={cx('hover:bg-surface-muted/60', className)} {...rest} />;
}

type CellOptions = {
  /** Right-aligns numbers so their digits line up. */
  numeric?: boolean;
};

// Cell styles are named classes (app/globals.css: .cell, .cell-head, .cell-num, tighter in a dense
// table): a long list repeats one short name per cell instead of a dozen utilities, in the HTML and
// again in the page's React payload. Utilities passed in className still win over them.

// No text-transform: units are case-sensitive (g/L is not G/L).
export function Th({ numeric, className, scope = 'col', ...rest }: ComponentPropsWithoutRef<'th'> & CellOptions) {
  return <th scope={scope} className={cx('cell-head', numeric && 'text-right', className)} {...rest} />;
}

export function Td({ numeric, className, ...rest }: ComponentPropsWithoutRef<'td'> & CellOptions) {
  return <td className={cx('cell', numeric && 'cell-num', className)} {...rest} />;
}
