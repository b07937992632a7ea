'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useId, useState } from 'react';
import {
  CellStyleModule,
  DateFilterModule,
  InfiniteRowModelModule,
  ModuleRegistry,
  NumberFilterModule,
  RowStyleModule,
  TextFilterModule,
  ValidationModule,
  type CellKeyDownEvent,
  type ColDef,
  type FullWidthCellKeyDownEvent,
  type GridReadyEvent,
  type RowClickedEvent,
} from 'ag-grid-community';
import { AgGridReact } from 'ag-grid-react';
import { Button } from '../ui/button';
import { cx } from '../ui/cx';
import { FormMessage } from '../ui/form-message';
import { downloadGridCsv, GRID_COUNT_CAP } from './grid-query';
import { gridTheme } from './grid-theme';
import { useGridSource } from './use-grid-source';

// Only what this grid uses (sorting, resizing, keyboard and ARIA come with the core). Each extra
// module adds to every page that shows a grid. Validation explains misconfigured columns in dev.
ModuleRegistry.registerModules([
  InfiniteRowModelModule,
  TextFilterModule,
  NumberFilterModule,
  DateFilterModule,
  CellStyleModule,
  RowStyleModule,
  ...(process.env.NODE_ENV === 'production' ? [] : [ValidationModule]),
]);

export type DataGridProps<T> = {
  /** JSON route answering `?offset=&limit=&sort=&filter=&q=` with `{ rows, total }`, and `?format=csv`. */
  url: string;
  /** ag-grid column definitions; keep the array stable (module constant or useMemo). Set `filter: 'agTextColumnFilter' | 'agNumberColumnFilter' | 'agDateColumnFilter'` per column. */
  columns: ColDef<T>[];
  /** Where a row leads; clicking the row or pressing Enter on it goes there (Ctrl/⌘-click opens a new tab). */
  getRowHref?: (row: T) => string | null | undefined;
  /** Grid height in px or any CSS length. */
  height?: number | string;
  /** Names the grid and its search box, e.g. "Quotes". */
  label?: string;
  /** Placeholder for the quick search, e.g. "Quote no., customer or part". */
  searchPlaceholder?: string;
  /** Rows per request. */
  blockSize?: number;
  /** Hides the CSV button where an export makes no sense. */
  allowCsv?: boolean;
  className?: string;
};

const SEARCH_DELAY_MS = 300;
// Hoisted: a new object each render would make the grid re-apply every column.
const defaultColDef: ColDef = { sortable: true, resizable: true, minWidth: 90, flex: 1 };
const countFormat = new Intl.NumberFormat('en-US');

export function DataGrid<T>({
  url,
  columns,
  getRowHref,
  height = 520,
  label = 'Records',
  searchPlaceholder = 'Search',
  blockSize = 100,
  allowCsv = true,
  className,
}: DataGridProps<T>) {
  const router = useRouter();
  const searchId = useId();
  const statusId = useId();
  const { datasource, view, total, error, setSearch, retry, attach } = useGridSource<T>({ url, blockSize });
  const [searchText, setSearchText] = useState('');
  const [csvPending, setCsvPending] = useState(false);
  const [csvError, setCsvError] = useState<string | null>(null);

  useEffect(() => {
    const timer = setTimeout(() => setSearch(searchText.trim()), SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [searchText, setSearch]);

  useEffect(() => () => attach(null), [attach]);

  function open(row: T | undefined, newTab: boolean) {
    const href = row && getRowHref?.(row);
    if (!href) return;
    if (newTab) window.open(href, '_blank', 'noopener');
    else router.push(href);
  }

  function onRowClicked(event: RowClickedEvent<T>) {
    const mouse = event.event as MouseEvent | null | undefined;
    open(event.data, Boolean(mouse && (mouse.ctrlKey || mouse.metaKey)));
  }

  function onCellKeyDown(event: CellKeyDownEvent<T> | FullWidthCellKeyDownEvent<T>) {
    const key = event.event as KeyboardEvent | null | undefined;
    if (key?.key === 'Enter') open(event.data, key.ctrlKey || key.metaKey);
  }

  async function onDownload() {
    setCsvPending(true);
    setCsvError(null);
    try {
      await downloadGridCsv(url, view);
    } catch (err) {
      setCsvError(err instanceof Error ? err.message : 'The CSV could not be downloaded.');
    } finally {
      setCsvPending(false);
    }
  }

  const status =
    total === null ? (error ? 'Not loaded' : 'Loading…') : total === 0 ? (view.q ? 'Nothing matches this search' : 'No rows yet') : total > GRID_COUNT_CAP ? `More than ${countFormat.format(GRID_COUNT_CAP)} rows` : `${countFormat.format(total)} ${total === 1 ? 'row' : 'rows'}`;

  return (
    <section aria-label={label} className={cx('flex flex-col gap-2', className)}>
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div className="flex min-w-0 flex-1 flex-col gap-1 sm:max-w-xs">
          <label htmlFor={searchId} className="text-sm font-medium text-ink">
            Search {label.toLowerCase()}
          </label>
          <input
            id={searchId}
            type="search"
            value={searchText}
            onChange={(e) => setSearchText(e.target.value)}
            placeholder={searchPlaceholder}
            aria-describedby={statusId}
            autoComplete="off"
            className="min-h-10 w-full rounded-md border border-surface-line bg-surface px-3 text-sm text-ink placeholder:text-ink-faint"
          />
        </div>
        <div className="flex items-center gap-3">
          <p id={statusId} aria-live="polite" className="text-sm text-ink-muted tabular">
            {status}
          </p>
          {allowCsv ? (
            <Button variant="secondary" size="md" pending={csvPending} pendingLabel="Preparing CSV…" onClick={onDownload} icon={<DownloadIcon />}>
              Download CSV
            </Button>
          ) : null}
        </div>
      </div>
      {error ? (
        <div className="flex flex-wrap items-center gap-2">
          <FormMessage tone="error" message={error} className="flex-1" />
          <Button variant="secondary" size="sm" onClick={retry}>
            Try again
          </Button>
        </div>
      ) : null}
      <FormMessage tone="error" message={csvError} />
      <div style={{ height }} className="w-full">
        <AgGridReact<T>
          theme={gridTheme}
          rowModelType="infinite"
          datasource={datasource}
          cacheBlockSize={blockSize}
          maxConcurrentDatasourceRequests={2}
          columnDefs={columns}
          defaultColDef={defaultColDef}
          // The server takes one sort column (sort=field:asc|desc).
          suppressMultiSort
          onGridReady={(event: GridReadyEvent<T>) => attach(event.api)}
          onRowClicked={getRowHref ? onRowClicked : undefined}
          onCellKeyDown={getRowHref ? onCellKeyDown : undefined}
          rowStyle={getRowHref ? { cursor: 'pointer' } : undefined}
        />
      </div>
    </section>
  );
}

function DownloadIcon() {
  return (
    <svg viewBox="0 0 16 16" className="size-4" focusable="false">
      <path d="M8 2.5v7.5M4.8 7 8 10.2 11.2 7M3 12.8h10" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
