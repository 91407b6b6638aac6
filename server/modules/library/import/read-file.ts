// Step 1 of the property-set import: the uploaded bytes → a table whose header is the template's
// columns (any order, optional ones may be left out). Files that cannot be read are refused here.
import { fileError, readCsvRows, type UploadedFile } from '../../../services/csv-text';
import { IMPORT_MAX_BYTES, IMPORT_MAX_ROWS } from '../../../../shared/schemas/library';
import { PROPERTY_SET_COLUMNS, type ImportColumn, type ImportColumnName } from '../../../../shared/import/property-set-columns';

export type { UploadedFile };

const COLUMNS: readonly ImportColumn[] = PROPERTY_SET_COLUMNS;
const BY_NAME = new Map(COLUMNS.map((c) => [c.name, c]));
const REQUIRED = COLUMNS.filter((c) => c.required).map((c) => c.name);

export interface CsvTable {
  /** The file's columns, in the file's order. */
  header: ImportColumn[];
  /** Data rows (header excluded); row i is data row i + 1. */
  rows: string[][];
}

/** Turns the bytes into a table, or refuses a file that cannot be read at all (400, 413). */
export function readCsv(file: UploadedFile): CsvTable {
  const [rawHeader, ...rows] = readCsvRows(file, IMPORT_MAX_BYTES);
  const header = rawHeader.map((h) => h.trim().toLowerCase());

  if (!header.some((h) => BY_NAME.has(h))) {
    const hint = rawHeader.length === 1 && /[;\t]/.test(rawHeader[0]) ? ' Separate the columns with commas.' : '';
    throw fileError(
      'not_csv',
      `This does not look like a property-set CSV: the first line must be the template's header (${REQUIRED.slice(0, 4).join(', ')}, …).${hint}`,
      { file: 'has no recognised header' },
    );
  }
  const missing = REQUIRED.filter((c) => !header.includes(c));
  if (missing.length) {
    throw fileError('missing_columns', `The file lacks required columns: ${missing.join(', ')}.`, { columns: `missing: ${missing.join(', ')}` });
  }
  const unknown = header.filter((h) => !BY_NAME.has(h));
  if (unknown.length) {
    throw fileError(
      'unknown_columns',
      `The file has columns the template does not: ${unknown.map((u) => u || '(blank)').join(', ')}. Remove them or use the template.`,
      { columns: `unknown: ${unknown.join(', ')}` },
    );
  }
  const duplicates = [...new Set(header.filter((h, i) => header.indexOf(h) !== i))];
  if (duplicates.length) {
    throw fileError('duplicate_columns', `Columns appear twice: ${duplicates.join(', ')}.`, { columns: `duplicated: ${duplicates.join(', ')}` });
  }
  if (rows.length === 0) throw fileError('no_rows', 'The file has a header but no rows.', { file: 'has no rows' });
  if (rows.length > IMPORT_MAX_ROWS) {
    const max = IMPORT_MAX_ROWS.toLocaleString('en-GB');
    throw fileError('too_many_rows', `The file has more than ${max} rows. Split it into files of at most ${max} rows.`, { file: `more than ${IMPORT_MAX_ROWS} rows` });
  }
  return { header: header.map((h) => BY_NAME.get(h as ImportColumnName)!), rows };
}
