// Turns a parsed grid query into SQL fragments over a column whitelist. Only whitelisted
// expressions ever reach the SQL; every value the client sends is a bound parameter.
import { type Expression, type RawBuilder, type SqlBool, sql } from 'kysely';
import type { ColumnFilter, DateCondition, GridColumnType, GridCondition, GridCursor, GridQuery, NumberCondition, TextCondition } from './query';

export type GridColumn = {
  /** A column reference ('customers.name') or any SQL expression. */
  expr: string | Expression<unknown>;
  type: GridColumnType;
  /** Included in the quick search `q` (compared as text, case-insensitive). */
  searchable?: boolean;
  /** Set false for columns without an index when the table can be large. */
  sortable?: boolean;
  /** CSV header; defaults to the column id. Set `csv: false` to leave the column out of the export. */
  header?: string;
  csv?: boolean;
  /**
   * A closed set of values (a status): text filters and the quick search are matched against the
   * set here, and each value found becomes `match(value)`, a plain predicate the planner can
   * estimate and index, instead of a pattern over the computed expression.
   */
  choices?: { values: readonly string[]; match: (value: string) => Expression<SqlBool> };
};

export type GridColumns = Record<string, GridColumn>;

// Expressions are wrapped in parentheses so `a + b` stays one operand next to `::text` or `<`.
export function columnExpr(col: GridColumn | undefined): Expression<unknown> {
  // Parsing checked every column id against the whitelist; reaching here without one is a bug.
  if (!col) throw new Error('Grid column missing from the whitelist.');
  return typeof col.expr === 'string' ? sql.ref(col.expr) : sql`(${col.expr})`;
}

/** A list's unique key (a column reference or an expression) as one operand. */
export function keyExpr(key: string | Expression<unknown>): Expression<unknown> {
  return typeof key === 'string' ? sql.ref(key) : sql`(${key})`;
}

/** Escapes LIKE wildcards so the user's text matches literally (backslash is PostgreSQL's default escape). */
export function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

const COMPARE: Record<'equals' | 'notEqual' | 'lessThan' | 'lessThanOrEqual' | 'greaterThan' | 'greaterThanOrEqual', string> = {
  equals: '=',
  notEqual: '<>',
  lessThan: '<',
  lessThanOrEqual: '<=',
  greaterThan: '>',
  greaterThanOrEqual: '>=',
};

function textCondition(e: Expression<unknown>, c: TextCondition): RawBuilder<SqlBool> {
  const v = escapeLike(c.value);
  switch (c.op) {
    case 'blank':
      return sql<SqlBool>`coalesce(${e}::text, '') = ''`;
    case 'notBlank':
      return sql<SqlBool>`coalesce(${e}::text, '') <> ''`;
    case 'equals':
      return sql<SqlBool>`${e}::text ilike ${v}`;
    case 'notEqual':
      return sql<SqlBool>`coalesce(${e}::text, '') not ilike ${v}`;
    case 'contains':
      return sql<SqlBool>`${e}::text ilike ${`%${v}%`}`;
    case 'notContains':
      return sql<SqlBool>`coalesce(${e}::text, '') not ilike ${`%${v}%`}`;
    case 'startsWith':
      return sql<SqlBool>`${e}::text ilike ${`${v}%`}`;
    case 'endsWith':
      return sql<SqlBool>`${e}::text ilike ${`%${v}`}`;
  }
}

function numberCondition(e: Expression<unknown>, c: NumberCondition): RawBuilder<SqlBool> {
  if (c.op === 'blank') return sql<SqlBool>`${e} is null`;
  if (c.op === 'notBlank') return sql<SqlBool>`${e} is not null`;
  if (c.op === 'inRange') {
    const [lo, hi] = [c.value as number, c.to as number].sort((a, b) => a - b);
    return sql<SqlBool>`${e} between ${lo} and ${hi}`;
  }
  return sql<SqlBool>`${e} ${sql.raw(COMPARE[c.op])} ${c.value}`;
}

// Days as half-open ranges so an index on a timestamp column still serves the filter.
function dateCondition(e: Expression<unknown>, c: DateCondition): RawBuilder<SqlBool> {
  if (c.op === 'blank') return sql<SqlBool>`${e} is null`;
  if (c.op === 'notBlank') return sql<SqlBool>`${e} is not null`;
  const from = sql`${c.value}::date`;
  const next = sql`(${c.value}::date + 1)`;
  switch (c.op) {
    case 'equals':
      return sql<SqlBool>`(${e} >= ${from} and ${e} < ${next})`;
    case 'notEqual':
      return sql<SqlBool>`(${e} < ${from} or ${e} >= ${next})`;
    case 'lessThan':
      return sql<SqlBool>`${e} < ${from}`;
    case 'lessThanOrEqual':
      return sql<SqlBool>`${e} < ${next}`;
    case 'greaterThan':
      return sql<SqlBool>`${e} >= ${next}`;
    case 'greaterThanOrEqual':
      return sql<SqlBool>`${e} >= ${from}`;
    case 'inRange': {
      const [lo, hi] = [c.value as string, c.to as string].sort();
      return sql<SqlBool>`(${e} >= ${lo}::date and ${e} < (${hi}::date + 1))`;
    }
  }
}

export function conditionSql(e: Expression<unknown>, c: GridCondition): RawBuilder<SqlBool> {
  if (c.kind === 'text') return textCondition(e, c);
  if (c.kind === 'number') return numberCondition(e, c);
  return dateCondition(e, c);
}

/** The values of a closed set a text condition keeps, as the ILIKE the other columns use would. */
export function choicesMatching(values: readonly string[], c: TextCondition): string[] {
  const v = c.value.toLowerCase();
  const keep = (x: string): boolean => {
    const t = x.toLowerCase();
    switch (c.op) {
      case 'blank':
        return t === '';
      case 'notBlank':
        return t !== '';
      case 'equals':
        return t === v;
      case 'notEqual':
        return t !== v;
      case 'contains':
        return t.includes(v);
      case 'notContains':
        return !t.includes(v);
      case 'startsWith':
        return t.startsWith(v);
      case 'endsWith':
        return t.endsWith(v);
    }
  };
  return values.filter(keep);
}

function anyOf(choices: NonNullable<GridColumn['choices']>, values: string[]): RawBuilder<SqlBool> {
  return values.length ? sql<SqlBool>`(${sql.join(values.map((v) => choices.match(v)), sql.raw(' or '))})` : sql<SqlBool>`false`;
}

function filterSql(columns: GridColumns, f: ColumnFilter): RawBuilder<SqlBool> {
  const col = columns[f.colId];
  const e = columnExpr(col);
  const choices = col?.choices;
  const parts = f.conditions.map((c) => (choices && c.kind === 'text' ? anyOf(choices, choicesMatching(choices.values, c)) : conditionSql(e, c)));
  return sql<SqlBool>`(${sql.join(parts, sql.raw(f.join === 'OR' ? ' or ' : ' and '))})`;
}

/**
 * A list's own quick search for one word, given the ILIKE pattern '%word%': used instead of the OR
 * over its searchable columns when that OR spans joined tables (which no index can serve), e.g. as
 * `key in (…one indexed select per table…)`. It must match exactly the rows the OR would.
 */
export type GridSearch = (pattern: string) => Expression<SqlBool>;

function searchSql(columns: GridColumns, words: string[], search?: GridSearch): RawBuilder<SqlBool> | null {
  const cols = Object.values(columns).filter((c) => c.searchable);
  if (cols.length === 0 || words.length === 0) return null;
  const perWord = words.map((w) => {
    const pattern = `%${escapeLike(w)}%`;
    if (search) return sql<SqlBool>`(${search(pattern)})`;
    return sql<SqlBool>`(${sql.join(
      cols.map((c) => (c.choices ? anyOf(c.choices, choicesMatching(c.choices.values, { kind: 'text', op: 'contains', value: w })) : sql`${columnExpr(c)}::text ilike ${pattern}`)),
      sql.raw(' or '),
    )})`;
  });
  return sql<SqlBool>`(${sql.join(perWord, sql.raw(' and '))})`;
}

/** The WHERE condition for the query's filters and quick search, or null when there is none. */
export function whereSql(columns: GridColumns, query: Pick<GridQuery, 'filters' | 'words'>, custom?: GridSearch): RawBuilder<SqlBool> | null {
  const parts = query.filters.map((f) => filterSql(columns, f));
  const search = searchSql(columns, query.words, custom);
  if (search) parts.push(search);
  return parts.length ? sql<SqlBool>`${sql.join(parts, sql.raw(' and '))}` : null;
}

/**
 * The ORDER BY terms: the chosen column, then a unique key so pages never overlap or skip rows
 * when sort values tie. No NULLS FIRST/LAST: the default ordering lets a plain btree index serve
 * both directions.
 */
export function orderSql(
  columns: GridColumns,
  sort: GridQuery['sort'],
  fallback: { colId: string; dir: 'asc' | 'desc' } | null,
  key: string | Expression<unknown>,
): RawBuilder<unknown>[] {
  const chosen = sort ?? fallback;
  const terms: RawBuilder<unknown>[] = [];
  if (chosen) terms.push(sql`${columnExpr(columns[chosen.colId])} ${sql.raw(chosen.dir)}`);
  terms.push(sql`${keyExpr(key)} ${sql.raw(chosen?.dir ?? 'asc')}`);
  return terms;
}

/**
 * The rows after a cursor in the order orderSql gives, as conditions to read one after another
 * until the page is full: (sort value, key) past the cursor's, then, where PostgreSQL puts empty
 * values (last going up, first going down), those. Each is a plain range an index on the sort
 * column can start at (an OR with "is null" would make the planner read from the top). The sort
 * value is bound untyped, so it takes the column's own type.
 */
export function afterSql(columns: GridColumns, cursor: GridCursor, key: string | Expression<unknown>): RawBuilder<SqlBool>[] {
  const k = keyExpr(key);
  if (cursor.colId === null) return [sql<SqlBool>`${k} ${sql.raw(cursor.dir === 'asc' ? '>' : '<')} ${cursor.key}`];
  const e = columnExpr(columns[cursor.colId]);
  const v = cursor.value;
  if (cursor.dir === 'asc') {
    return v === null
      ? [sql<SqlBool>`(${e} is null and ${k} > ${cursor.key})`]
      : [sql<SqlBool>`(${e} >= ${v} and (${e} > ${v} or ${k} > ${cursor.key}))`, sql<SqlBool>`${e} is null`];
  }
  return v === null
    ? [sql<SqlBool>`(${e} is null and ${k} < ${cursor.key})`, sql<SqlBool>`${e} is not null`]
    : [sql<SqlBool>`(${e} <= ${v} and (${e} < ${v} or ${k} < ${cursor.key}))`];
}
