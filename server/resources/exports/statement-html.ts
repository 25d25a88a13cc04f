import type { ExportTable } from './export-table';

const escapeHtml = (text: string) =>
  text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );

/** Numbers with thousands separators, at most four decimals (the statement is read, not recomputed). */
const formatCell = (cell: string | number | null) =>
  cell === null ? '—' : typeof cell === 'number' ? cell.toLocaleString('en-US', { maximumFractionDigits: 4 }) : cell;

/**
 * A self-contained HTML statement: a print stylesheet (A4 landscape, the table's head repeated on
 * every page, "Page n of m" in the page margin) and the status stamped across the top.
 */
export function statementHtml(table: ExportTable, status: string): string {
  const header = table.header
    .map(([label, value]) => `<tr><th scope="row">${escapeHtml(label)}</th><td>${escapeHtml(value)}</td></tr>`)
    .join('');
  const head = table.columns.map((c) => `<th scope="col">${escapeHtml(c)}</th>`).join('');
  const body = table.rows
    .map(
      (row) =>
        `<tr>${row
          .map(
            (cell) => `<td class="${typeof cell === 'number' ? 'num' : 'text'}">${escapeHtml(formatCell(cell))}</td>`,
          )
          .join('')}</tr>`,
    )
    .join('');
  const title = `Monthly volumes statement — ${table.header[0][1]} — ${table.header[1][1]}`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<style>
  body { font: 12px/1.4 system-ui, sans-serif; color: #111; margin: 24px; }
  h1 { font-size: 18px; margin: 0 0 8px; }
  .stamp { display: inline-block; border: 3px solid currentColor; padding: 4px 12px; font-weight: 700;
    text-transform: uppercase; letter-spacing: 0.1em; transform: rotate(-4deg); margin: 8px 0 16px; }
  .stamp.closed { color: #1b5e20; } .stamp.complete { color: #0d47a1; } .stamp.provisional { color: #b71c1c; }
  table { border-collapse: collapse; margin-bottom: 16px; }
  .header th { text-align: left; padding: 2px 12px 2px 0; }
  .volumes th, .volumes td { border: 1px solid #999; padding: 3px 6px; }
  .volumes thead th { background: #eee; }
  td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
  .volumes tbody tr:last-child, .volumes tbody tr.total { font-weight: 700; }
  @page { size: A4 landscape; margin: 14mm 12mm 16mm;
    @bottom-right { content: "Page " counter(page) " of " counter(pages); font: 10px system-ui, sans-serif; } }
  @media print {
    body { margin: 0; }
    .volumes thead { display: table-header-group; }
    .volumes tr { break-inside: avoid; }
    .no-print { display: none; }
  }
</style></head>
<body>
<h1>${escapeHtml(title)}</h1>
<div class="stamp ${escapeHtml(status)}" data-testid="statement-status">${escapeHtml(status)}</div>
<table class="header">${header}</table>
<table class="volumes"><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>
<p class="no-print"><button onclick="window.print()">Print</button></p>
</body></html>
`;
}
