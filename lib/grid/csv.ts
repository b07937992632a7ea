// CSV text for exports: RFC 4180 quoting, CRLF line ends, and a guard against spreadsheet
// formula injection (a cell starting with = + - @, tab or carriage return is prefixed with a quote).
// Source: RFC 4180 §2; OWASP "CSV Injection" guidance for the prefix.

const FORMULA_START = /^[=+\-@\t\r]/;

export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return '';
  let text: string;
  if (value instanceof Date) text = Number.isNaN(value.getTime()) ? '' : value.toISOString();
  else if (typeof value === 'number') text = Number.isFinite(value) ? String(value) : '';
  else if (typeof value === 'object') text = JSON.stringify(value);
  else text = String(value);
  // Numbers are data, not formulas: a negative amount keeps its minus sign.
  if (typeof value !== 'number' && FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(values: readonly unknown[]): string {
  return `${values.map(csvCell).join(',')}\r\n`;
}

/** A file name safe in a Content-Disposition header, with the UTF-8 form for other characters. */
export function contentDisposition(kind: 'attachment' | 'inline', fileName: string): string {
  const cleaned = fileName.replace(/[\u0000-\u001f\u007f/\\]/g, '_').trim() || 'download';
  const ascii = cleaned.replace(/[^\x20-\x7e]/g, '_').replace(/["%;]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(cleaned)}`;
}
