// Reading an uploaded CSV file into rows of cells: UTF-8 text (a BOM is allowed), comma-separated,
// blank lines skipped. Anything that is not such a file is refused with a 400 (413 if too large)
// that says how to save it properly. Used by every CSV import.
import Papa from 'papaparse';
import { AppError, type ErrorCode } from '../errors';

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
  size: number;
}

export const fileError = (code: ErrorCode, message: string, fields?: Record<string, string>) => new AppError(400, code, message, fields);

/** The file's rows of cells (header included), or a 400/413 for a file that cannot be read as CSV text. */
export function readCsvRows(file: UploadedFile, maxBytes: number): string[][] {
  const bytes = file.buffer;
  if (bytes.length > maxBytes) {
    throw new AppError(413, 'too_large', `The file is larger than ${maxBytes / 1024 / 1024} MB. Split it into smaller files.`);
  }
  if (bytes.length === 0) throw fileError('empty_file', 'The file is empty.', { file: 'is empty' });
  // Text never contains NUL; spreadsheets, archives, images and UTF-16 text all do.
  if (bytes.includes(0)) {
    throw fileError('not_text', 'This is not a CSV text file (it contains binary data). Save the sheet as "CSV UTF-8" and try again.', {
      file: 'is not a text file',
    });
  }
  let text: string;
  try {
    // fatal: invalid byte sequences (e.g. Latin-1 "é" = 0xE9) throw instead of becoming U+FFFD.
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw fileError('not_utf8', 'The file is not UTF-8 text. Save it as "CSV UTF-8" and try again.', { file: 'is not UTF-8' });
  }
  if (!text.trim()) throw fileError('empty_file', 'The file is empty.', { file: 'is empty' });

  const parsed = Papa.parse<string[]>(text, {
    delimiter: ',',
    header: false,
    // Blank lines are skipped. (No `preview` cap: Papa counts blank lines towards it, which would
    // cut a file with blank lines short without a word. The size limit bounds the work instead.)
    skipEmptyLines: 'greedy',
  });
  const quoteError = parsed.errors.find((e) => e.type === 'Quotes');
  if (quoteError) {
    const row = typeof quoteError.row === 'number' ? quoteError.row : undefined;
    throw fileError(
      'not_csv',
      `The file is not valid CSV: ${quoteError.message}${row !== undefined ? ` (near data row ${row})` : ''}. Check the quotes in that row.`,
      { file: 'is not valid CSV' },
    );
  }
  if (!parsed.data[0]) throw fileError('empty_file', 'The file is empty.', { file: 'is empty' });
  return parsed.data;
}
