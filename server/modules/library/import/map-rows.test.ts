import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { PROPERTY_SET_COLUMNS, targetsOf, type ImportColumn, type ImportColumnName } from '../../../../shared/import/property-set-columns';
import { rowMapper } from './map-rows';
import { templateCsv } from './template';

const COLUMNS: readonly ImportColumn[] = PROPERTY_SET_COLUMNS;

/** A valid row in the Harrow Sound scenario (invented acceptance-test values), with changes. */
function cells(changes: Partial<Record<ImportColumnName, string>> = {}, columns: readonly ImportColumn[] = COLUMNS): string[] {
  const values: Record<string, string> = {
    material: 'Cast acrylic (PMMA)',
    family: 'acrylic',
    transparent: 'yes',
    condition: 'Harrow Sound viewport blank 1, 120 mm cast sheet',
    reference_title: 'Harrow Sound Marine Works acceptance tests, viewport blanks 2026',
    reference_kind: 'test-report',
    reference_year: '2026',
    reference_identifier: 'HSMW-TR-0200',
    basis: 'minimum',
    density_kg_m3: '1190',
    youngs_modulus_gpa: '3.1',
    poissons_ratio: '0.37',
    tensile_strength_mpa: '70',
    compressive_strength_mpa: '110',
    compressive_yield_mpa: '105',
    shear_strength_mpa: '60',
    elongation_pct: '3',
    luminous_transmittance_pct: '91',
    service_temp_min_c: '10',
    service_temp_max_c: '66',
    ...changes,
  };
  return columns.map((c) => values[c.name] ?? '');
}

const mapRow = rowMapper(COLUMNS);
const fields = (row: string[], map = mapRow) => map(row).issues.map((i) => i.field).sort();
const messageOf = (row: string[], field: string) => mapRow(row).issues.find((i) => i.field === field)?.message;

describe('a row → a draft', () => {
  it('converts each number from its column’s unit to SI through the units table', () => {
    const { draft, issues } = mapRow(cells());
    expect(issues).toEqual([]);
    expect(draft).toMatchObject({
      youngsModulus: 3.1e9, // 3.1 GPa
      tensileStrength: 70e6, // 70 MPa
      compressiveYield: 105e6,
      density: 1190, // kg/m³ is SI
      poissonsRatio: 0.37,
      serviceTemperature: { min: 10, max: 66 }, // °C is how Isobath stores temperatures
    });
    expect(draft!.elongation).toBeCloseTo(0.03, 15); // 3 %
    expect(draft!.luminousTransmittance).toBeCloseTo(0.91, 15);
  });

  it('places text, choices and yes/no at their draft paths, normalising the spelling of choices', () => {
    const { draft } = mapRow(cells({ transparent: 'Y', reference_kind: 'Test Report', family: ' ACRYLIC ' }));
    expect(draft!.material).toEqual({ name: 'Cast acrylic (PMMA)', family: 'acrylic', transparent: true });
    expect(draft!.reference).toEqual({
      kind: 'test-report',
      title: 'Harrow Sound Marine Works acceptance tests, viewport blanks 2026',
      year: 2026,
      identifier: 'HSMW-TR-0200',
    });
  });

  it('gives the basis to every strength, and to a yield only when the row has that yield', () => {
    const { draft } = mapRow(cells({ basis: 'statistical-allowable' }));
    const basis = { basis: 'statistical-allowable' };
    expect(draft!.valueDetails).toEqual({ tensileStrength: basis, compressiveStrength: basis, shearStrength: basis, compressiveYield: basis });
    expect(mapRow(cells({ tensile_yield_mpa: '65' })).draft!.valueDetails.tensileYield).toEqual({ basis: 'minimum' });
  });

  it('leaves blank optional cells out and calls blank required cells required', () => {
    const { draft } = mapRow(cells({ elongation_pct: '', reference_year: '' }));
    expect(draft!.elongation).toBeUndefined();
    expect(draft!.reference!.year).toBeUndefined();
    expect(mapRow(cells({ condition: ' ', density_kg_m3: '' })).issues).toEqual([
      { field: 'condition', message: 'is required' },
      { field: 'density_kg_m3', message: 'is required' },
    ]);
  });

  it('reports cells that cannot be read', () => {
    expect(messageOf(cells({ tensile_strength_mpa: 'seventy' }), 'tensile_strength_mpa')).toMatch(/must be a number/);
    expect(messageOf(cells({ tensile_strength_mpa: '1,200' }), 'tensile_strength_mpa')).toMatch(/no thousands separators/);
    expect(messageOf(cells({ tensile_strength_mpa: '1e999' }), 'tensile_strength_mpa')).toBe('must be a finite number');
    expect(messageOf(cells({ transparent: 'perhaps' }), 'transparent')).toBe('must be yes or no');
    expect(messageOf(cells({ reference_year: '2026.5' }), 'reference_year')).toBe('must be a whole number');
  });

  it('words the draft schema’s issues for a CSV cell, bounds in the column’s unit', () => {
    expect(messageOf(cells({ family: 'unobtainium' }), 'family')).toMatch(/^must be one of: acrylic, polycarbonate, .*syntactic-foam$/);
    expect(messageOf(cells({ condition: 'x'.repeat(301) }), 'condition')).toBe('is longer than 300 characters');
    expect(messageOf(cells({ reference_year: '1700' }), 'reference_year')).toBe('must be at least 1800');
    expect(messageOf(cells({ shear_strength_mpa: '0' }), 'shear_strength_mpa')).toBe('must be greater than zero');
    expect(messageOf(cells({ service_temp_min_c: '-300' }), 'service_temp_min_c')).toMatch(/absolute zero/);
    expect(messageOf(cells({ elongation_pct: '140' }), 'elongation_pct')).toMatch(/100 %/);
  });

  it('reports cell errors and cross-field errors of one row in the same round', () => {
    const row = cells({ density_kg_m3: 'heavy', family: 'unobtainium', tensile_yield_mpa: '90', service_temp_min_c: '80', service_temp_max_c: '10' });
    expect(fields(row)).toEqual(['density_kg_m3', 'family', 'service_temp_max_c', 'tensile_yield_mpa']);
    expect(messageOf(row, 'tensile_yield_mpa')).toBe('Tensile yield cannot exceed tensile strength');
    expect(messageOf(row, 'service_temp_max_c')).toBe('min must not exceed max');
  });

  it('reports a row with the wrong number of fields as a whole-row issue', () => {
    expect(mapRow(cells().slice(0, 5)).issues).toEqual([{ field: '_', message: `has 5 fields; the header has ${COLUMNS.length}` }]);
  });

  it('maps the columns of a file in the file’s order, without the optional ones', () => {
    const required = [...COLUMNS].filter((c) => c.required).reverse();
    const { draft, issues } = rowMapper(required)(cells({}, required));
    expect(issues).toEqual([]);
    expect(draft).toMatchObject({ youngsModulus: 3.1e9, serviceTemperature: { min: 10, max: 66 } });
    expect(draft!.compressiveYield).toBeUndefined();
  });
});

describe('the column list', () => {
  it('has unique lower-case names, and each number with a unit names one the units table has', () => {
    const names = COLUMNS.map((c) => c.name);
    expect(new Set(names).size).toBe(names.length);
    for (const c of COLUMNS) {
      expect(c.name).toMatch(/^[a-z0-9_]+$/);
      if (c.unit !== undefined) expect(c.cell, c.name).toBe('number');
    }
    expect(() => rowMapper([{ name: 'depth_fathoms', fills: 'density', cell: 'number', quantity: 'depth', unit: 'fathom', required: false, help: '' }])(['1'])).toThrow(
      /units table has no depth unit "fathom"/,
    );
  });

  it('fills only paths of the draft: the template’s rows become drafts carrying every column’s value', () => {
    const [header, ...rows] = Papa.parse<string[]>(templateCsv().trim(), { delimiter: ',' }).data;
    expect(header).toEqual(COLUMNS.map((c) => c.name));
    for (const row of rows) {
      const { draft, issues } = mapRow(row);
      expect(issues).toEqual([]);
      COLUMNS.forEach((c, i) => {
        if (!row[i]) return;
        for (const t of targetsOf(c)) {
          if (t.onlyWith && !row[COLUMNS.findIndex((o) => targetsOf(o).some((x) => x.path === t.onlyWith))]) continue;
          const value = t.path.split('.').reduce<unknown>((node, key) => (node as Record<string, unknown>)?.[key], draft);
          expect(value, `${c.name} → ${t.path}`).toBeDefined();
        }
      });
    }
  });

  it('a column declared once reaches the template and the mapping', () => {
    const shearYield: ImportColumn = { name: 'shear_yield_mpa', fills: 'shearYield', cell: 'number', quantity: 'stress', unit: 'MPa', required: false, help: 'Shear yield' };
    const columns = [...COLUMNS, shearYield];
    expect(templateCsv(columns).split('\r\n')[0].split(',').at(-1)).toBe('shear_yield_mpa');
    const map = rowMapper(columns);
    expect(map([...cells(), '41.4']).draft!.shearYield).toBe(41.4e6);
    expect(map([...cells(), '-5']).issues).toEqual([{ field: 'shear_yield_mpa', message: 'must be greater than zero' }]);
  });
});
