import type { ReactNode } from 'react';
import { Card } from './card';
import { Table, TBody, TFoot, Td, Th, THead, Tr } from './table';

export type SimpleColumn<T> = {
  /** The column's header; wrap it in `sr-only` for a column of buttons or links. */
  header: ReactNode;
  cell: (row: T) => ReactNode;
  /** Right-aligns the header and the cells. */
  numeric?: boolean;
  /** Classes of the column's cells, fixed or by row. */
  className?: string | ((row: T) => string | undefined);
};

type RowAttributes = { className?: string; [data: `data-${string}`]: string | boolean | undefined };

export type SimpleTableProps<T> = {
  /** The table's accessible name, read by screen readers and hidden on screen. */
  caption: string;
  columns: readonly SimpleColumn<T>[];
  rows: readonly T[];
  rowKey: (row: T) => string;
  /** Shown instead of the table when there are no rows; without it the header stands alone. */
  empty?: ReactNode;
  /** Class or data attributes of a row's <tr>, e.g. to grey out a retired record. */
  rowAttributes?: (row: T) => RowAttributes;
  /** Fixed rows after the data rows (subtotals, charges), as <Tr> elements. */
  extraRows?: ReactNode;
  /** Rows of the table's foot (totals), as <tr> elements. */
  footer?: ReactNode;
  dense?: boolean;
  /** In an unpadded card, the way list pages show a table; the empty state stays outside it. */
  framed?: boolean;
};

/** A short list as a semantic table, one column definition per column. Long or filterable lists belong in DataGrid. */
export function SimpleTable<T>({ caption, columns, rows, rowKey, empty, rowAttributes, extraRows, footer, dense, framed }: SimpleTableProps<T>) {
  if (rows.length === 0 && empty !== undefined) return <>{empty}</>;
  const table = (
    <Table caption={caption} captionHidden dense={dense}>
      <THead>
        <tr>
          {columns.map((c, i) => (
            <Th key={i} numeric={c.numeric}>
              {c.header}
            </Th>
          ))}
        </tr>
      </THead>
      <TBody>
        {rows.map((row) => (
          <Tr key={rowKey(row)} {...rowAttributes?.(row)}>
            {columns.map((c, i) => (
              <Td key={i} numeric={c.numeric} className={typeof c.className === 'function' ? c.className(row) : c.className}>
                {c.cell(row)}
              </Td>
            ))}
          </Tr>
        ))}
        {extraRows}
      </TBody>
      {footer ? <TFoot>{footer}</TFoot> : null}
    </Table>
  );
  return framed ? <Card padding="none">{table}</Card> : table;
}
