import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { PROPERTY_SET_COLUMNS, targetsOf, unitOfColumn, type ImportColumn, type ImportColumnName } from '../../../../shared/import/property-set-columns';
import { PROVENANCE_KEYS, presentKeys } from '../../../../shared/schemas/provenance';
import { QUANTITIES } from '../../../../shared/schemas/quantities';
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

describe('the status of each value', () => {
  it('gives the row’s status, location and source to every value the row has, and none to the values it lacks', () => {
    const { draft, issues } = mapRow(cells({ status: 'Confirmed', status_location: 'Table 2', status_source: 'HSMW-TR-0200 annex B', temperature_factors: '23:1; 50:0.8' }));
    expect(issues).toEqual([]);
    const entry = { status: 'confirmed', location: 'Table 2', source: 'HSMW-TR-0200 annex B' };
    expect(draft!.provenance).toEqual({
      density: entry,
      youngsModulus: entry,
      poissonsRatio: entry,
      tensileStrength: entry,
      compressiveStrength: entry,
      compressiveYield: entry,
      shearStrength: entry,
      elongation: entry,
      luminousTransmittance: entry,
      serviceTemperature: entry,
      temperatureFactors: entry,
    });
  });

  it('leaves the statuses out when the row’s status is blank (the values are recalled)', () => {
    expect(mapRow(cells()).draft!.provenance).toEqual({});
    expect(mapRow(cells({ status: 'recalled' })).draft!.provenance.density).toEqual({ status: 'recalled' });
  });

  it('lets a value’s own status replace the row’s, taking none of the row’s location, source or rule', () => {
    const { draft, issues } = mapRow(
      cells({
        status: 'confirmed',
        status_location: 'Table 2',
        status_source: 'HSMW-TR-0200 annex B',
        shear_strength_status: 'derived',
        shear_strength_rule: 'taken as 0.55 of the tensile strength',
        density_location: 'Table 1',
        elongation_status: 'recalled',
      }),
    );
    expect(issues).toEqual([]);
    expect(draft!.provenance.shearStrength).toEqual({ status: 'derived', rule: 'taken as 0.55 of the tensile strength' });
    expect(draft!.provenance.elongation).toEqual({ status: 'recalled' });
    // A value's own location alone keeps the row's status and source.
    expect(draft!.provenance.density).toEqual({ status: 'confirmed', location: 'Table 1', source: 'HSMW-TR-0200 annex B' });
    expect(draft!.provenance.tensileStrength).toEqual({ status: 'confirmed', location: 'Table 2', source: 'HSMW-TR-0200 annex B' });
  });

  it('refuses a confirmed value without a location at the column that lacks it, once per column', () => {
    const row = cells({ status: 'confirmed', shear_strength_status: 'confirmed', density_status: 'confirmed', density_location: 'Table 1' });
    expect(mapRow(row).issues.sort((a, b) => a.field.localeCompare(b.field))).toEqual([
      { field: 'shear_strength_location', message: 'is required for a confirmed value (table, page, figure or clause)' },
      { field: 'status_location', message: 'is required for a confirmed value (table, page, figure or clause)' },
    ]);
  });

  it('refuses a derived value without its rule, at the row’s rule or the value’s own', () => {
    expect(mapRow(cells({ status: 'derived' })).issues).toEqual([{ field: 'status_rule', message: 'is required for a derived value (the rule it comes from)' }]);
    expect(mapRow(cells({ status: 'demo', tensile_strength_status: 'derived', tensile_strength_location: 'Table 2' })).issues).toEqual([
      { field: 'tensile_strength_rule', message: 'is required for a derived value (the rule it comes from)' },
    ]);
  });

  it('asks for the status a location, source or rule belongs to', () => {
    expect(mapRow(cells({ status_location: 'Table 2' })).issues).toEqual([{ field: 'status', message: 'is required when status_location is given' }]);
    expect(mapRow(cells({ density_source: 'HSMW-TR-0200 annex B' })).issues).toEqual([{ field: 'density_status', message: 'is required when density_source is given' }]);
  });

  it('refuses a status that is not one of the four, and text too short to say anything', () => {
    expect(messageOf(cells({ status: 'checked' }), 'status')).toBe('must be one of: confirmed, recalled, derived, demo');
    expect(messageOf(cells({ tensile_strength_status: 'maybe' }), 'tensile_strength_status')).toBe('must be one of: confirmed, recalled, derived, demo');
    expect(messageOf(cells({ status: 'confirmed', status_location: 'x' }), 'status_location')).toBe('must have at least 2 characters');
    expect(messageOf(cells({ status: 'demo', status_source: 'y'.repeat(301) }), 'status_source')).toBe('is longer than 300 characters');
  });

  it('carries a status for the service range and for each list of points', () => {
    const { draft } = mapRow(
      cells({ service_temperature_status: 'demo', cyclic_factors: '1:1; 1000:0.8', cyclic_factors_status: 'confirmed', cyclic_factors_location: 'Figure 4', cyclic_factors_source: 'HSMW-TR-0201' }),
    );
    expect(draft!.provenance).toEqual({ serviceTemperature: { status: 'demo' }, cyclicFactors: { status: 'confirmed', location: 'Figure 4', source: 'HSMW-TR-0201' } });
  });
});

describe('test method and test temperature', () => {
  it('gives the row’s test method and temperature to the strengths and yields the row has', () => {
    const { draft, issues } = mapRow(cells({ test_method: 'ASTM D638', test_temperature_c: '23', tensile_yield_mpa: '65' }));
    expect(issues).toEqual([]);
    const d = { basis: 'minimum', testMethod: 'ASTM D638', temperature: 23 };
    expect(draft!.valueDetails).toEqual({ tensileStrength: d, tensileYield: d, compressiveStrength: d, compressiveYield: d, shearStrength: d });
  });

  it('lets a value’s own basis, method and temperature win over the row’s, and gives other quantities their own', () => {
    const { draft, issues } = mapRow(
      cells({
        test_method: 'ASTM D638',
        test_temperature_c: '23',
        compressive_strength_test_method: 'ASTM D695',
        shear_strength_basis: 'typical',
        shear_strength_test_temperature_c: '-10',
        density_basis: 'typical',
        density_test_method: 'ASTM D792',
      }),
    );
    expect(issues).toEqual([]);
    expect(draft!.valueDetails.compressiveStrength).toEqual({ basis: 'minimum', testMethod: 'ASTM D695', temperature: 23 });
    expect(draft!.valueDetails.shearStrength).toEqual({ basis: 'typical', testMethod: 'ASTM D638', temperature: -10 });
    expect(draft!.valueDetails.density).toEqual({ basis: 'typical', testMethod: 'ASTM D792' });
    expect(draft!.valueDetails.youngsModulus).toBeUndefined();
  });

  it('asks for the basis of a value given a method or temperature but no basis', () => {
    expect(mapRow(cells({ density_test_method: 'ASTM D792' })).issues).toEqual([{ field: 'density_basis', message: 'is required when density_test_method is given' }]);
  });

  it('reports bad method and temperature cells, bounds in °C', () => {
    expect(messageOf(cells({ test_temperature_c: 'room' }), 'test_temperature_c')).toMatch(/must be a number/);
    expect(messageOf(cells({ test_temperature_c: '-300' }), 'test_temperature_c')).toBe('must be at least -273.15 °C');
    expect(messageOf(cells({ tensile_strength_test_temperature_c: '2500' }), 'tensile_strength_test_temperature_c')).toBe('must be at most 2000 °C');
    expect(messageOf(cells({ test_method: 'M'.repeat(121) }), 'test_method')).toBe('is longer than 120 characters');
    expect(messageOf(cells({ density_basis: 'guessed' }), 'density_basis')).toBe('must be one of: minimum, typical, statistical-allowable');
  });
});

describe('lists of points', () => {
  it('reads x:factor points separated by semicolons, with spaces and a trailing semicolon, in the row’s order', () => {
    const { draft, issues } = mapRow(cells({ temperature_factors: ' -20 : 1.15;23:1 ; 50:0.8;', sustained_load_factors: '0:1; 1e5:0.5', cyclic_factors: '10000:0.7' }));
    expect(issues).toEqual([]);
    expect(draft!.temperatureFactors).toEqual([
      { temperature: -20, factor: 1.15 },
      { temperature: 23, factor: 1 },
      { temperature: 50, factor: 0.8 },
    ]);
    expect(draft!.sustainedLoadFactors).toEqual([
      { hours: 0, factor: 1 },
      { hours: 100000, factor: 0.5 },
    ]);
    expect(draft!.cyclicFactors).toEqual([{ cycles: 10000, factor: 0.7 }]);
  });

  it('names the part that is not a point', () => {
    expect(messageOf(cells({ temperature_factors: '-20:1.15; 23-1; 50:0.8' }), 'temperature_factors')).toBe(
      "'23-1' is not temperature:factor (write the points as temperature:factor, separated by semicolons)",
    );
    expect(messageOf(cells({ sustained_load_factors: '1000:0,7' }), 'sustained_load_factors')).toMatch(/^'1000:0,7' is not hours:factor/);
    expect(messageOf(cells({ cyclic_factors: '1:1:1' }), 'cyclic_factors')).toMatch(/^'1:1:1' is not cycles:factor/);
    expect(messageOf(cells({ cyclic_factors: '1e999:1' }), 'cyclic_factors')).toBe("'1e999:1' has a number that is not finite");
    expect(messageOf(cells({ temperature_factors: ' ; ;' }), 'temperature_factors')).toMatch(/^has no points/);
  });

  it('words the schema’s refusal of a point with its number and what is wrong', () => {
    expect(messageOf(cells({ temperature_factors: '23:1; 50:0' }), 'temperature_factors')).toBe('point 2: factor must be greater than zero');
    expect(messageOf(cells({ temperature_factors: '-300:1' }), 'temperature_factors')).toBe('point 1: temperature must not be below absolute zero (-273.15 °C)');
    expect(messageOf(cells({ sustained_load_factors: '-5:1' }), 'sustained_load_factors')).toBe('point 1: hours must be zero or more');
    const many = Array.from({ length: 51 }, (_, i) => `${i}:1`).join('; ');
    expect(messageOf(cells({ cyclic_factors: many }), 'cyclic_factors')).toBe('has more than 50 points');
  });
});

describe('the column list', () => {
  it('has unique lower-case names, and each column with a unit names one the units table has', () => {
    const names = COLUMNS.map((c) => c.name);
    expect(new Set(names).size).toBe(names.length);
    for (const c of COLUMNS) {
      expect(c.name).toMatch(/^[a-z0-9_]+$/);
      if (c.unit !== undefined) expect(['number', 'points'], c.name).toContain(c.cell);
      if (c.unit !== undefined) expect(unitOfColumn(c)!.label, c.name).toBe(c.unit);
    }
    expect(() => rowMapper([{ name: 'depth_fathoms', fills: 'density', cell: 'number', quantity: 'depth', unit: 'fathom', required: false, help: '' }])(['1'])).toThrow(
      /units table has no depth unit "fathom"/,
    );
  });

  it('has each value’s own columns for every value that carries a status, generated from the list of values', () => {
    const own = (suffix: string) => COLUMNS.filter((c) => c.perValue?.suffix === suffix).map((c) => c.perValue!.key);
    for (const suffix of ['status', 'location', 'source', 'rule']) expect(own(suffix), suffix).toEqual([...PROVENANCE_KEYS]);
    for (const suffix of ['basis', 'test_method', 'test_temperature_c']) expect(own(suffix), suffix).toEqual([...QUANTITIES]);
    expect(names(COLUMNS)).toEqual(expect.arrayContaining(['tensile_strength_status', 'youngs_modulus_test_method', 'service_temperature_location', 'sustained_load_factors_rule']));
  });

  it('fills only paths of the draft: the template’s rows become drafts carrying every column’s value', () => {
    const [header, ...rows] = Papa.parse<string[]>(templateCsv().trim(), { delimiter: ',' }).data;
    expect(header).toEqual(names(COLUMNS));
    expect(rows).toHaveLength(2);
    for (const row of rows) {
      const { draft, issues } = mapRow(row);
      expect(issues).toEqual([]);
      const given = (path: string) => COLUMNS.some((o, j) => row[j] && targetsOf(o).some((x) => x.path === path && !x.onlyWith && !x.unless));
      COLUMNS.forEach((c, i) => {
        if (!row[i]) return;
        for (const t of targetsOf(c)) {
          const only = t.onlyWith && valueAtPath(draft, t.onlyWith);
          if (t.onlyWith && (only === undefined || (Array.isArray(only) && !only.length))) continue;
          if (t.unless?.some(given)) continue;
          expect(valueAtPath(draft, t.path), `${c.name} → ${t.path}`).toBeDefined();
        }
      });
    }
  });

  it('marks the template’s invented example rows as demo data, every value of them', () => {
    const [, ...rows] = Papa.parse<string[]>(templateCsv().trim(), { delimiter: ',' }).data;
    for (const row of rows) {
      const draft = mapRow(row).draft!;
      const statuses = presentKeys(draft).map((k) => draft.provenance[k]?.status);
      expect(statuses.filter((s) => s === 'demo').length, row[0]).toBeGreaterThan(statuses.length / 2);
      expect(statuses.every((s) => s === 'demo' || s === 'derived'), row[0]).toBe(true);
      expect(row[COLUMNS.findIndex((c) => c.name === 'condition')]).toBeTruthy();
    }
  });

  it('a column declared once reaches the template and the mapping', () => {
    // A test temperature in °F (a unit of the units table) for density, beside density's basis.
    const densityAtF: ImportColumn = { name: 'density_test_temperature_f', fills: 'valueDetails.density.temperature', cell: 'number', quantity: 'temperature', unit: '°F', required: false, help: '' };
    const columns = [...COLUMNS, densityAtF];
    expect(templateCsv(columns).split('\r\n')[0].split(',').at(-1)).toBe('density_test_temperature_f');
    const map = rowMapper(columns);
    expect(map([...cells({ density_basis: 'typical' }), '212']).draft!.valueDetails.density!.temperature).toBeCloseTo(100, 10);
    expect(map([...cells({ density_basis: 'typical' }), '-500']).issues).toEqual([{ field: 'density_test_temperature_f', message: 'must be at least -459.67 °F' }]);
  });
});

const names = (columns: readonly ImportColumn[]) => columns.map((c) => c.name);
const valueAtPath = (node: unknown, path: string) => path.split('.').reduce<unknown>((n, key) => (n as Record<string, unknown> | undefined)?.[key], node);
