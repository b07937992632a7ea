import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { SimpleTable, type SimpleColumn, type SimpleTableProps } from '@/components/ui/simple-table';

type Row = { id: string; code: string; grams: number; retired: boolean };

const columns: SimpleColumn<Row>[] = [
  { header: 'Code', className: (r) => (r.retired ? 'line-through' : undefined), cell: (r) => r.code },
  { header: 'Mass', numeric: true, cell: (r) => `${r.grams} g` },
];
const rows: Row[] = [
  { id: 'a', code: 'NI-1', grams: 12, retired: false },
  { id: 'b', code: 'ZN-2', grams: 7, retired: true },
];

const html = (props: Partial<SimpleTableProps<Row>> = {}) =>
  renderToStaticMarkup(createElement(SimpleTable<Row>, { caption: 'Finishes', columns, rows, rowKey: (r) => r.id, ...props }));

describe('SimpleTable', () => {
  it('names the table by a caption hidden on screen and scopes each header to its column', () => {
    const out = html();
    expect(out).toMatch(/<caption class="[^"]*sr-only[^"]*">Finishes<\/caption>/);
    expect(out.match(/<th scope="col"/g)).toHaveLength(2);
    expect(out).toMatch(/<th scope="col" class="[^"]*text-right[^"]*">Mass<\/th>/);
  });

  it('renders one row per record, in order, with per-row cell classes and row attributes', () => {
    const out = html({ rowAttributes: (r) => (r.retired ? { className: 'text-ink-muted', 'data-retired': true } : {}) });
    const bodyRows = (out.split('<tbody')[1] ?? '').match(/<tr[^>]*>.*?<\/tr>/g) ?? [];
    expect(bodyRows).toHaveLength(2);
    expect(bodyRows[0]).toContain('NI-1');
    expect(bodyRows[0]).not.toContain('line-through');
    expect(bodyRows[1]).toMatch(/<tr class="[^"]*text-ink-muted" data-retired="true">/);
    expect(bodyRows[1]).toMatch(/<td class="[^"]*line-through">ZN-2<\/td>/);
    // Numbers are right-aligned by the cell-num class (app/globals.css: whitespace-nowrap text-right).
    expect(bodyRows[1]).toMatch(/<td class="[^"]*cell-num[^"]*">7 g<\/td>/);
  });

  it('shows the empty state instead of the table when there are no rows, and the bare header without one', () => {
    const empty = createElement('p', null, 'No finishes yet');
    expect(html({ rows: [], empty })).toBe('<p>No finishes yet</p>');
    const bare = html({ rows: [] });
    expect(bare).toContain('<th scope="col"');
    expect(bare).toMatch(/<tbody[^>]*><\/tbody>/);
  });

  it('frames the table in a card only when asked, and adds the extra rows and the foot', () => {
    expect(html()).not.toContain('<section');
    const out = html({ framed: true, extraRows: createElement('tr', null, createElement('td', null, 'Subtotal')), footer: createElement('tr', null, createElement('td', null, 'Total')) });
    expect(out.startsWith('<section')).toBe(true);
    expect(out).toMatch(/ZN-2.*Subtotal<\/td><\/tr><\/tbody><tfoot[^>]*><tr><td>Total<\/td><\/tr><\/tfoot>/);
  });
});
