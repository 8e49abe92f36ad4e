/**
 * A block copied from a spreadsheet arrives as tab-separated text, one line per row (the
 * text/plain clipboard format spreadsheet programs write; common practice, no source).
 */
export type PastedBlock =
  | { outcome: 'parsed'; values: (number | null)[][] }
  | { outcome: 'rejected'; problems: string[] };

/** Reads one pasted cell: '1,250' and '1 250' mean 1250; '12,5' means 12.5; empty means "leave as is". */
export function parsePastedNumber(raw: string): number | null | 'invalid' {
  const text = raw.trim().replace(/^"(.*)"$/, '$1').replace(/[\s\u00a0]/g, '');
  if (text === '') return null;
  let normal = text;
  if (/^\d{1,3}(,\d{3})+(\.\d+)?$/.test(text)) normal = text.replace(/,/g, '');
  else if (/^\d{1,3}(\.\d{3})+(,\d+)?$/.test(text)) normal = text.replace(/\./g, '').replace(',', '.');
  else if (/^\d+,\d+$/.test(text)) normal = text.replace(',', '.');
  if (!/^\d+(\.\d+)?$/.test(normal)) return 'invalid';
  return Number(normal);
}

/** Most problems listed after a rejected paste; the rest are counted. */
const maxProblemsListed = 5;

export function parsePastedBlock(text: string): PastedBlock {
  const lines = text.replace(/\r\n?/g, '\n').split('\n');
  while (lines.length > 0 && lines[lines.length - 1] === '') lines.pop();
  if (lines.length === 0) return { outcome: 'rejected', problems: ['The clipboard holds no cells.'] };
  const problems: string[] = [];
  let count = 0;
  const values = lines.map((line, r) =>
    line.split('\t').map((cell, c) => {
      const n = parsePastedNumber(cell);
      if (n === 'invalid') {
        count += 1;
        if (problems.length < maxProblemsListed) problems.push(`Row ${r + 1}, column ${c + 1}: “${cell.trim()}” is not a quantity (whole or decimal number, not negative).`);
        return null;
      }
      return n;
    }),
  );
  if (count > problems.length) problems.push(`… and ${count - problems.length} more.`);
  return problems.length ? { outcome: 'rejected', problems } : { outcome: 'parsed', values };
}
