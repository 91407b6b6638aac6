// A rating table's grid from a CSV file, for the draft editor: it writes nothing. Every cell is
// checked, and the grid against the rating-table rules (rows and columns ascending, requirement
// never falling), with each problem named by its row and column.
//
//   minimum-ratio:     design_pressure_<unit>,<T1 °C>,<T2 °C>,…   then one row per pressure, t/Di cells (empty = no value)
//   critical-pressure: thickness_ratio,critical_pressure_<unit>     then one row per point
// <unit> is pa, kpa, mpa, bar or psi; values are stored in Pa.
import Papa from 'papaparse';
import { AppError } from '../../errors';
import { fileError, readCsvRows, type UploadedFile } from '../../services/csv-text';
import { criticalPressureDataSchema, minimumRatioDataSchema, type RatingTableCsvDto, type RatingTableData } from '../../../shared/schemas/rating-tables';

export const RATING_CSV_MAX_BYTES = 1024 * 1024;
const PA_PER: Record<string, number> = { pa: 1, kpa: 1e3, mpa: 1e6, bar: 1e5, psi: 6894.757293168 };

const number = (raw: string): number | null => {
  const t = raw.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return null;
  return Number(t);
};

function invalid(fields: Record<string, string>): AppError {
  const n = Object.keys(fields).length;
  return new AppError(400, 'import_invalid', `The table has ${n} problem${n === 1 ? '' : 's'}; nothing was read into the draft.`, fields);
}

/** Schema issue paths (['ratios', i, j]) as CSV places ("rows.<i+1>.<column header>"). */
function placeOf(path: readonly PropertyKey[], header: string[]): string {
  const [field, i, j] = path;
  if (field === 'ratios' && typeof i === 'number') return `rows.${i + 1}.${typeof j === 'number' ? header[j + 1] : header[0]}`;
  if ((field === 'pressures' || field === 'ratios' || field === 'criticalPressures') && i === undefined) return `columns.${header[0]}`;
  if (field === 'temperatures') return 'columns.temperatures';
  return typeof i === 'number' ? `rows.${i + 1}.${String(field)}` : String(field);
}

export function parseRatingTableCsv(file: UploadedFile, form: 'minimum-ratio' | 'critical-pressure'): RatingTableCsvDto {
  const [rawHeader, ...rows] = readCsvRows(file, RATING_CSV_MAX_BYTES);
  const header = rawHeader.map((h) => h.trim().toLowerCase());
  if (rows.length === 0) throw fileError('no_rows', 'The file has a header but no rows.', { file: 'has no rows' });
  if (rows.length > 200) throw fileError('too_many_rows', 'A rating table has at most 200 rows.', { file: 'more than 200 rows' });
  const fields: Record<string, string> = {};

  if (form === 'minimum-ratio') {
    const unit = /^design_pressure_(pa|kpa|mpa|bar|psi)$/.exec(header[0] ?? '')?.[1];
    if (!unit) throw fileError('missing_columns', 'The first column must be design_pressure_pa, _kpa, _mpa, _bar or _psi.', { columns: 'first column: design_pressure_<unit>' });
    const temperatures = header.slice(1).map((h, j) => {
      const t = number(h.replace(/\s*°?c$/, ''));
      if (t === null) fields[`columns.${rawHeader[j + 1] || `(column ${j + 2})`}`] = 'A temperature column heading must be a number of °C.';
      return t ?? Number.NaN;
    });
    if (temperatures.length === 0) throw fileError('missing_columns', 'Give at least one temperature column after the pressure column.', { columns: 'no temperature columns' });
    const pressures: number[] = [];
    const ratios: (number | null)[][] = [];
    rows.forEach((cells, i) => {
      const p = number(cells[0] ?? '');
      if (p === null || !(p > 0)) fields[`rows.${i + 1}.${header[0]}`] = 'Must be a design pressure greater than zero.';
      pressures.push((p ?? Number.NaN) * PA_PER[unit]);
      if (cells.length > header.length) fields[`rows.${i + 1}`] = `Has ${cells.length} cells; the header has ${header.length}.`;
      ratios.push(
        temperatures.map((_, j) => {
          const raw = (cells[j + 1] ?? '').trim();
          if (raw === '') return null;
          const r = number(raw);
          if (r === null || !(r > 0)) fields[`rows.${i + 1}.${header[j + 1]}`] = 'Must be a thickness ratio greater than zero, or empty.';
          return r;
        }),
      );
    });
    if (Object.keys(fields).length) throw invalid(fields);
    const checked = minimumRatioDataSchema.safeParse({ form, pressures, temperatures, ratios });
    if (!checked.success) {
      for (const issue of checked.error.issues) fields[placeOf(issue.path, header)] ??= issue.message;
      throw invalid(fields);
    }
    return { data: checked.data };
  }

  const unit = /^critical_pressure_(pa|kpa|mpa|bar|psi)$/.exec(header[1] ?? '')?.[1];
  if (header[0] !== 'thickness_ratio' || !unit || header.length !== 2) {
    throw fileError('missing_columns', 'The columns must be thickness_ratio and critical_pressure_<unit> (pa, kpa, mpa, bar or psi).', { columns: 'thickness_ratio, critical_pressure_<unit>' });
  }
  const ratios: number[] = [];
  const criticalPressures: number[] = [];
  rows.forEach((cells, i) => {
    const r = number(cells[0] ?? '');
    const p = number(cells[1] ?? '');
    if (r === null || !(r > 0)) fields[`rows.${i + 1}.thickness_ratio`] = 'Must be a thickness ratio greater than zero.';
    if (p === null || !(p > 0)) fields[`rows.${i + 1}.${header[1]}`] = 'Must be a pressure greater than zero.';
    ratios.push(r ?? Number.NaN);
    criticalPressures.push((p ?? Number.NaN) * PA_PER[unit]);
  });
  if (Object.keys(fields).length) throw invalid(fields);
  // Conversion factors are entered in the editor; 1 here only lets the grid be checked.
  const checked = criticalPressureDataSchema.safeParse({ form, ratios, criticalPressures, conversionFactors: [{ temperature: 24, factor: 1 }] });
  if (!checked.success) {
    for (const issue of checked.error.issues) fields[placeOf(issue.path, header)] ??= issue.message;
    throw invalid(fields);
  }
  return { data: { ...checked.data, conversionFactors: [] } as unknown as RatingTableData };
}

/** The header of a rating-table CSV (and one empty row to fill). */
export function ratingTableTemplate(form: 'minimum-ratio' | 'critical-pressure'): string {
  const rows = form === 'minimum-ratio' ? [['design_pressure_bar', '10', '24', '38', '52', '66']] : [['thickness_ratio', 'critical_pressure_mpa']];
  return Papa.unparse(rows, { newline: '\r\n' }) + '\r\n';
}
