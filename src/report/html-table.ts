/**
 * Result tables as HTML, for a web page or a notebook: the same title, headings and cells as the text
 * tables ({@link renderTable}), in a `<table>` with the title as its caption.
 */
import { requireShape } from '../errors/arguments.js';
import { wrongArgument } from '../errors/messages.js';
import type { TextTable } from './table.js';

/** Escape text for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  if (typeof text !== 'string') throw wrongArgument('text', text, 'a string');
  return text.replace(/[<>&"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/**
 * Draws a table as an HTML `<table class="quiescent">`: the title as its `<caption>`, the headings in
 * `<thead>`, one `<tr>` per row in `<tbody>`; number columns are aligned right. Text is escaped.
 *
 * @param table - the title, columns and rows (from `acTable`, `operatingPointTables`, …)
 * @returns the HTML text
 * @example
 * ```ts
 * htmlTable({ title: 'Supply rails', columns: [{ header: 'rail' }, { header: 'voltage', align: 'right' }], rows: [['vcc', '9 V']] });
 * ```
 */
export function htmlTable(table: TextTable): string {
  requireShape(table, 'table', 'a text table { title, columns, rows }', ['columns', 'rows']);
  const align = table.columns.map((column) => (column.align === 'right' ? ' style="text-align:right"' : ''));
  const head = table.columns.map((column, c) => `<th${align[c]}>${escapeHtml(column.header)}</th>`).join('');
  const body = table.rows
    .map(
      (row) =>
        `<tr>${table.columns.map((_, c) => `<td${align[c]}>${escapeHtml(row[c] ?? '')}</td>`).join('')}</tr>`,
    )
    .join('\n');
  return [
    '<table class="quiescent">',
    `<caption>${escapeHtml(table.title)}</caption>`,
    `<thead><tr>${head}</tr></thead>`,
    `<tbody>${body === '' ? `<tr><td colspan="${table.columns.length}">(none)</td></tr>` : `\n${body}\n`}</tbody>`,
    '</table>',
  ].join('\n');
}
