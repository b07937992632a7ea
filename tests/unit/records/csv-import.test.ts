import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { customerFields } from '@/lib/customers/schemas';
import { duplicateKeys, parseImportCsv, templateCsv, validateRows, type ImportColumn } from '@/lib/imports/csv-rows';
import { parseScaledDecimal } from '@/lib/records/fields';

const COLUMNS: ImportColumn[] = [
  { column: 'code', field: 'code', required: true, example: 'ACME', hint: '' },
  { column: 'name', field: 'name', required: true, example: 'Acme', hint: '' },
  { column: 'payment_terms_days', field: 'paymentTermsDays', required: true, example: '30', hint: '' },
  { column: 'tax_rate_percent', field: 'taxRatePercent', required: true, example: '7.25', hint: '' },
  { column: 'billing_email', field: 'billingEmail', required: false, example: '', hint: '' },
];
const schema = z.object({ code: customerFields.code, name: customerFields.name, paymentTermsDays: customerFields.paymentTermsDays, taxRatePercent: customerFields.taxRatePercent, billingEmail: customerFields.billingEmail });

describe('parseImportCsv', () => {
  it('numbers rows as a spreadsheet does and reads quoted cells (RFC 4180)', () => {
    const text = '\ufeffCode,Name,payment_terms_days,tax_rate_percent\r\nAB,"Smith, Jones ""&"" Co",30,7\r\n\r\nCD,Other,15,0\r\n';
    const { rows, problems } = parseImportCsv(text, COLUMNS);
    expect(problems).toEqual([]);
    expect(rows).toEqual([
      { row: 2, values: { code: 'AB', name: 'Smith, Jones "&" Co', payment_terms_days: '30', tax_rate_percent: '7' } },
      { row: 3, values: { code: 'CD', name: 'Other', payment_terms_days: '15', tax_rate_percent: '0' } },
    ]);
  });

  it('names missing and unknown columns against the header row', () => {
    const { problems } = parseImportCsv('code,name,colour\nAB,x,red\n', COLUMNS);
    expect(problems).toEqual([
      { row: 1, column: 'colour', message: expect.stringMatching(/^Unknown column/) },
      { row: 1, column: 'payment_terms_days', message: 'This column is missing.' },
      { row: 1, column: 'tax_rate_percent', message: 'This column is missing.' },
    ]);
  });

  it('reports a row with too many cells', () => {
    const { problems } = parseImportCsv('code,name,payment_terms_days,tax_rate_percent\nAB,x,30,7,extra\n', COLUMNS);
    expect(problems).toEqual([{ row: 2, column: '—', message: 'This row has more cells than the header.' }]);
  });

  it('says when there are no rows', () => {
    expect(parseImportCsv('code,name,payment_terms_days,tax_rate_percent\n', COLUMNS).problems).toEqual([{ row: 2, column: '—', message: 'The file has a header but no rows.' }]);
  });
});

describe('validateRows', () => {
  it('lists every problem by row and column', () => {
    const { rows } = parseImportCsv('code,name,payment_terms_days,tax_rate_percent,billing_email\nok-1,Fine,30,7.25,\nx,,thirty,7.125,not-an-email\n', COLUMNS);
    const { valid, problems } = validateRows(rows, COLUMNS, schema);
    expect(valid).toEqual([{ row: 2, data: { code: 'OK-1', name: 'Fine', paymentTermsDays: 30, taxRatePercent: 725, billingEmail: null } }]);
    expect(problems.map((p) => [p.row, p.column])).toEqual([
      [3, 'code'],
      [3, 'name'],
      [3, 'payment_terms_days'],
      [3, 'tax_rate_percent'],
      [3, 'billing_email'],
    ]);
  });

  it('finds repeated keys and names the first row', () => {
    const rows = [
      { row: 2, data: { code: 'AB' } },
      { row: 3, data: { code: 'CD' } },
      { row: 4, data: { code: 'AB' } },
    ];
    expect(duplicateKeys(rows, (d) => d.code, 'code', (d) => `Code ${d.code}`)).toEqual([{ row: 4, column: 'code', message: 'Code AB is also on row 2.' }]);
  });

  it('writes a template whose header the parser accepts', () => {
    const { rows, problems } = parseImportCsv(templateCsv(COLUMNS), COLUMNS);
    expect(problems).toEqual([]);
    expect(validateRows(rows, COLUMNS, schema).problems).toEqual([]);
  });
});

describe('parseScaledDecimal', () => {
  it('scales exactly without floating-point error', () => {
    // 0.1 + 0.2 style errors: 1.15 × 100 is 114.99999999999999 in binary floating point.
    expect(1.15 * 100).not.toBe(115);
    expect(parseScaledDecimal('1.15', 2)).toBe(115);
    expect(parseScaledDecimal('7', 2)).toBe(700);
    expect(parseScaledDecimal('7.', 2)).toBe(700);
    expect(parseScaledDecimal('12.345', 2)).toBeNull();
    expect(parseScaledDecimal('-1', 2)).toBeNull();
    expect(parseScaledDecimal('1e3', 2)).toBeNull();
  });
});
