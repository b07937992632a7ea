'use client';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import useSWR, { useSWRConfig } from 'swr';
import type { GridApi, IDatasource, IGetRowsParams } from 'ag-grid-community';
import { buildGridUrl, fetchGridPage, lastRowOf, type GridPage, type GridSortItem, type GridView } from './grid-query';

type Options = { url: string; blockSize: number };

function sameView(url: string, a: GridView, b: GridView): boolean {
  return buildGridUrl(url, a, { format: 'csv' }) === buildGridUrl(url, b, { format: 'csv' });
}

/**
 * Feeds ag-grid's infinite row model from a JSON route through SWR.
 *
 * Every block goes through SWR's cache under its own URL. The first block of the current view is
 * also watched with useSWR, so SWR's usual triggers (window focus, reconnect, a `mutate()` of that
 * URL after a save elsewhere) refresh what the grid shows without fetching on mount twice.
 */
export function useGridSource<T>({ url, blockSize }: Options) {
  const { mutate } = useSWRConfig();
  const apiRef = useRef<GridApi<T> | null>(null);
  const qRef = useRef('');
  const [view, setView] = useState<GridView>({ sort: [], filter: null, q: '' });
  const [total, setTotal] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  // First blocks already given to the grid, so a re-render with the same object is not "new".
  const served = useRef(new WeakSet<GridPage<T>>());
  // A first block SWR fetched by itself (focus, mutate) that the next getRows should use as is.
  const fresh = useRef<{ key: string; page: GridPage<T> } | null>(null);
  // Where each block after a loaded one starts by key ("view|startRow" → the server's cursor), so
  // scrolling down seeks instead of counting offsets. Only for the view it was made in.
  const cursors = useRef(new Map<string, string>());

  const firstKey = buildGridUrl(url, view, { offset: 0, limit: blockSize });
  const { data: watched } = useSWR<GridPage<T>>(firstKey, fetchGridPage<T>, {
    revalidateOnMount: false,
    revalidateIfStale: false,
    revalidateOnFocus: true,
    revalidateOnReconnect: true,
    shouldRetryOnError: false,
  });

  useEffect(() => {
    if (!watched || served.current.has(watched)) return;
    fresh.current = { key: firstKey, page: watched };
    // Keeps the rows on screen while the grid asks again; no loading flash.
    apiRef.current?.refreshInfiniteCache();
  }, [watched, firstKey]);

  const datasource = useMemo<IDatasource>(
    () => ({
      getRows(params: IGetRowsParams<T>) {
        const current: GridView = {
          sort: params.sortModel as GridSortItem[],
          filter: (params.filterModel as Record<string, unknown> | null) ?? null,
          q: qRef.current,
        };
        const viewKey = buildGridUrl(url, current, { format: 'csv' });
        const isFirst = params.startRow === 0;
        // A new view, or a refresh from the top, starts over: a cursor from before could skip a row
        // that moved up into the block before it. Until the next block's cursor arrives, offset.
        if (isFirst) cursors.current.clear();
        const after = isFirst ? null : (cursors.current.get(`${viewKey}|${params.startRow}`) ?? null);
        const key = buildGridUrl(url, current, { offset: params.startRow, limit: params.endRow - params.startRow, after });
        const cached = isFirst && fresh.current?.key === key ? fresh.current.page : null;
        if (isFirst) fresh.current = null;
        const load: Promise<GridPage<T> | undefined> = cached
          ? Promise.resolve(cached)
          : mutate<GridPage<T>>(key, fetchGridPage<T>(key), { revalidate: false });
        const fail = (message: string) => {
          setError(message);
          params.failCallback();
        };
        load.then(
          (page) => {
            if (!page) return fail('The list answered with no data.');
            if (isFirst) {
              served.current.add(page);
              // Only now, with the page in SWR's cache: a watched key without data would fetch again.
              setView((old) => (sameView(url, old, current) ? old : current));
            }
            if (page.next) cursors.current.set(`${viewKey}|${params.startRow + page.rows.length}`, page.next);
            setTotal(page.total);
            setError(null);
            params.successCallback(page.rows, lastRowOf(page.total, params.startRow, page.rows.length, params.endRow - params.startRow));
          },
          (err: unknown) => fail(err instanceof Error ? err.message : 'The list could not be loaded.'),
        );
      },
    }),
    [url, mutate],
  );

  const setSearch = useCallback((q: string) => {
    if (q === qRef.current) return;
    qRef.current = q;
    apiRef.current?.purgeInfiniteCache();
  }, []);

  const retry = useCallback(() => {
    setError(null);
    apiRef.current?.purgeInfiniteCache();
  }, []);

  const attach = useCallback((api: GridApi<T> | null) => {
    apiRef.current = api;
  }, []);

  return { datasource, view, total, error, setSearch, retry, attach };
}
