// The property-set CSV template: the column list's names as the header, and two example rows
// (invented Harrow Sound data, marked demo).
import Papa from 'papaparse';
import { PROPERTY_SET_COLUMNS, type ImportColumnName } from '../../../../shared/import/property-set-columns';

type Example = Partial<Record<ImportColumnName, string | number>>;

/**
 * Two invented Harrow Sound acceptance tests that show the units and formats; they are not data
 * to rely on, and every value says so: the row's status is demo. The first shows each strength's
 * own test method and the three lists of points; the second a value with its own status (a shear
 * yield derived by a named rule). A column the examples do not mention is left blank.
 */
const EXAMPLES: Example[] = [
  {
    material: 'Cast acrylic (PMMA)',
    family: 'acrylic',
    transparent: 'yes',
    condition: 'Harrow Sound lot 7 cast sheet, 100 mm, as supplied',
    reference_title: 'Harrow Sound Marine Works acceptance tests, viewport sheet lot 7',
    reference_kind: 'test-report',
    reference_authors: 'Harrow Sound Marine Works test laboratory',
    reference_year: 2026,
    reference_identifier: 'HSMW-TR-0007',
    reference_location: 'Table 2',
    basis: 'minimum',
    test_temperature_c: 23,
    status: 'demo',
    status_location: 'Table 2 (invented for the Harrow Sound demonstration)',
    density_kg_m3: 1190,
    youngs_modulus_gpa: 3.1,
    poissons_ratio: 0.37,
    tensile_strength_mpa: 70,
    compressive_strength_mpa: 110,
    compressive_yield_mpa: 105,
    shear_strength_mpa: 60,
    elongation_pct: 3,
    luminous_transmittance_pct: 91,
    service_temp_min_c: 10,
    service_temp_max_c: 66,
    temperature_factors: '10:1.1; 23:1; 52:0.8; 66:0.65',
    sustained_load_factors: '0:1; 1000:0.7; 100000:0.5',
    cyclic_factors: '1:1; 1000:0.85; 10000:0.7',
    density_basis: 'typical',
    density_test_method: 'ASTM D792',
    tensile_strength_test_method: 'ASTM D638',
    compressive_strength_test_method: 'ASTM D695',
    compressive_yield_test_method: 'ASTM D695',
    shear_strength_test_method: 'ASTM D732',
  },
  {
    material: 'Titanium alloy Ti-6Al-4V',
    family: 'titanium-alloy',
    transparent: 'no',
    condition: 'Annealed plate, hull ring forging stock',
    reference_title: 'Harrow Sound Marine Works acceptance tests, hull ring forging stock',
    reference_kind: 'test-report',
    reference_year: 2026,
    reference_identifier: 'HSMW-TR-0012',
    basis: 'typical',
    test_temperature_c: 20,
    status: 'demo',
    density_kg_m3: 4430,
    youngs_modulus_gpa: 114,
    poissons_ratio: 0.34,
    tensile_strength_mpa: 950,
    tensile_yield_mpa: 880,
    compressive_strength_mpa: 970,
    compressive_yield_mpa: 900,
    shear_strength_mpa: 550,
    shear_yield_mpa: 508,
    elongation_pct: 14,
    service_temp_min_c: -40,
    service_temp_max_c: 300,
    tensile_strength_test_method: 'ASTM E8',
    tensile_yield_test_method: 'ASTM E8',
    compressive_strength_test_method: 'ASTM E9',
    compressive_yield_test_method: 'ASTM E9',
    shear_yield_status: 'derived',
    shear_yield_rule: 'tensile yield/√3 (von Mises)',
  },
];

/** The template file: header and example rows, CRLF line ends. */
export function templateCsv(columns: readonly { name: string }[] = PROPERTY_SET_COLUMNS): string {
  const header = columns.map((c) => c.name);
  const rows = [header, ...EXAMPLES.map((example) => header.map((h) => String(example[h as ImportColumnName] ?? '')))];
  return Papa.unparse(rows, { newline: '\r\n' }) + '\r\n';
}
