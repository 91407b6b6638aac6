// CSV import on the library desk: preview with row-level issues, all-or-nothing import, and
// refusal of files that cannot be read at all.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { AuditEntry, Material, PropertySet, Reference, User } from '../../server/db/models';
import { IMPORT_COLUMNS, IMPORT_MAX_BYTES, IMPORT_MAX_ROWS, type ImportPreviewDto, type LibrarySetDto } from '../../shared/schemas/library';
import { targetsOf, unitOfColumn } from '../../shared/import/property-set-columns';
import { demoEmail } from '../helpers/app';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let librarian: Agent;
let admin: Agent;
let librarianId: number;

beforeAll(async () => {
  handle = await startTestApp();
  librarian = await signIn(handle.app, 'librarian');
  admin = await signIn(handle.app, 'admin');
  librarianId = (await User.findOne({ where: { email: demoEmail('librarian') } }))!.id;
});
afterAll(async () => {
  await handle.stop();
});

const HEADER = IMPORT_COLUMNS.map((c) => c.name);
type Row = Partial<Record<(typeof HEADER)[number], string | number>>;

/** A valid row in the Harrow Sound scenario (invented acceptance-test values), with changes. */
function row(n: number, changes: Row = {}): string[] {
  const values: Row = {
    material: 'Cast acrylic (PMMA)',
    family: 'acrylic',
    transparent: 'yes',
    condition: `Harrow Sound viewport blank ${n}, 120 mm cast sheet`,
    reference_title: 'Harrow Sound Marine Works acceptance tests, viewport blanks 2026',
    reference_kind: 'test-report',
    reference_authors: 'Harrow Sound Marine Works test laboratory',
    reference_year: 2026,
    reference_identifier: 'HSMW-TR-0200',
    reference_location: `Sheet ${n}`,
    basis: 'minimum',
    density_kg_m3: 1190,
    youngs_modulus_gpa: 3.1,
    poissons_ratio: 0.37,
    tensile_strength_mpa: 70,
    tensile_yield_mpa: '',
    compressive_strength_mpa: 110,
    compressive_yield_mpa: 105,
    shear_strength_mpa: 60,
    elongation_pct: 3,
    luminous_transmittance_pct: 91,
    service_temp_min_c: 10,
    service_temp_max_c: 66,
    ...changes,
  };
  return HEADER.map((h) => String(values[h] ?? ''));
}

const quote = (cell: string) => (/[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
const csv = (rows: string[][], header: readonly string[] = HEADER) => [header, ...rows].map((r) => r.map(quote).join(',')).join('\r\n') + '\r\n';

function manyRows(count: number): string {
  const lines = [HEADER.join(',')];
  const template = row(0);
  for (let i = 1; i <= count; i++) {
    template[3] = `Harrow Sound viewport blank ${i}, 120 mm cast sheet`;
    template[9] = `Sheet ${i}`;
    lines.push(template.map(quote).join(','));
  }
  return lines.join('\n') + '\n';
}

const upload = (agent: Agent | ReturnType<typeof request>, path: string, content: Buffer | string, name = 'blanks.csv') =>
  agent.post(path).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), { filename: name, contentType: 'text/csv' });

const counts = async () => [await PropertySet.count(), await Material.count(), await Reference.count(), await AuditEntry.count()];

describe('who may import', () => {
  it('answers 401 to an anonymous caller', async () => {
    expect((await request(handle.app).get('/api/library/import/template.csv')).status).toBe(401);
    expect((await upload(request(handle.app), '/api/library/import/preview', csv([row(1)]))).status).toBe(401);
    expect((await upload(request(handle.app), '/api/library/import', csv([row(1)]))).status).toBe(401);
  });

  it.each(['viewer', 'engineer', 'checker'] as const)('answers 403 to the %s and writes nothing', async (role) => {
    const agent = await signIn(handle.app, role);
    const before = await counts();
    expect((await agent.get('/api/library/import/template.csv')).status).toBe(403);
    expect((await upload(agent, '/api/library/import/preview', csv([row(1)]))).status).toBe(403);
    expect((await upload(agent, '/api/library/import', csv([row(1)]))).status).toBe(403);
    expect(await counts()).toEqual(before);
  });
});

describe('the template', () => {
  it('has the import columns as its header and two example rows that preview without issues', async () => {
    const res = await librarian.get('/api/library/import/template.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="[a-z-]+\.csv"$/);
    const lines = res.text.trim().split(/\r\n/);
    expect(lines[0]).toBe(HEADER.join(','));
    expect(lines).toHaveLength(3);
    const preview = await upload(librarian, '/api/library/import/preview', res.text, 'template.csv');
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ rows: 2, valid: 2, issueCount: 0, issues: [] });
  });
});

describe('a valid file', () => {
  it('previews rows in SI with new materials and references, writing nothing', async () => {
    const file = csv([
      row(1),
      row(2, { material: 'Harrow Sound trial glass-ceramic HS-4', family: 'glass-ceramic', transparent: 'no', tensile_strength_mpa: '85.5' }),
    ]);
    const before = await counts();
    const res = await upload(librarian, '/api/library/import/preview', file);
    expect(res.status).toBe(200);
    const preview = res.body as ImportPreviewDto;
    expect(preview).toMatchObject({ rows: 2, valid: 2, issueCount: 0, issues: [] });
    expect(preview.sample[0]).toEqual({
      row: 1,
      material: 'Cast acrylic (PMMA)',
      family: 'acrylic',
      condition: 'Harrow Sound viewport blank 1, 120 mm cast sheet',
      reference: 'Harrow Sound Marine Works acceptance tests, viewport blanks 2026',
      tensileStrength: 70e6,
      compressiveStrength: 110e6,
      shearStrength: 60e6,
      status: { confirmed: 0, total: 10, demo: false },
    });
    expect(preview.sample[1].tensileStrength).toBe(85.5e6);
    expect(preview.newMaterials).toEqual(['Harrow Sound trial glass-ceramic HS-4']);
    expect(preview.newReferences).toEqual(['Harrow Sound Marine Works acceptance tests, viewport blanks 2026']);
    expect(await counts()).toEqual(before);
  });

  it('imports every row as a draft by the caller, matching materials case-insensitively, with one audit entry', async () => {
    const file = `\ufeff${csv([row(1, { material: 'cast ACRYLIC (pmma)' }), row(2, { material: 'Harrow Sound trial syntactic foam HS-S1', family: 'syntactic-foam', transparent: 'no', luminous_transmittance_pct: '' })])}`;
    const [sets, materials, references] = await counts();
    const res = await upload(librarian, '/api/library/import', file, 'viewport-blanks.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.created).toBe(2);
    expect(res.body.ids).toHaveLength(2);
    expect(await PropertySet.count()).toBe(sets + 2);
    expect(await Material.count()).toBe(materials + 1);
    expect(await Reference.count()).toBe(references + 1);

    const created = await PropertySet.findAll({ where: { id: res.body.ids }, include: ['material', 'reference'], order: [['id', 'ASC']] });
    expect(created.map((s) => s.material!.name)).toEqual(['Cast acrylic (PMMA)', 'Harrow Sound trial syntactic foam HS-S1']);
    for (const s of created) {
      expect(s).toMatchObject({ status: 'draft', version: 1, lineageId: s.id, draftedById: librarianId, lastEditedById: librarianId });
      expect(s.youngsModulus).toBeCloseTo(3.1e9, 0);
      expect(s.elongation).toBeCloseTo(0.03, 12);
      expect(s.valueDetails.tensileStrength).toEqual({ basis: 'minimum' });
      expect(s.reference!.identifier).toBe('HSMW-TR-0200');
    }
    expect(created[1].luminousTransmittance).toBeNull();
    expect(created[0].condition).toBe('Harrow Sound viewport blank 1, 120 mm cast sheet');

    const audit = await admin.get('/api/admin/audit?entityType=import');
    expect(audit.body.items[0]).toMatchObject({ action: 'import', actor: { id: librarianId }, after: { fileName: 'viewport-blanks.csv', created: 2 } });

    // Quotes, commas, backslashes, braces and accents survive the trip into the database.
    const tricky = 'Blank "A", 6" {edge} \\ back, Ø 300 mm, état recuit';
    const odd = await upload(librarian, '/api/library/import', csv([row(9, { condition: tricky })]));
    expect(odd.status).toBe(201);
    expect((await PropertySet.findByPk(odd.body.ids[0]))!.condition).toBe(tricky);

    // Later imports of the same reference match it instead of creating another.
    const again = await upload(librarian, '/api/library/import', csv([row(3)]));
    expect(again.status).toBe(201);
    expect(await Reference.count()).toBe(references + 1);
  });
});

describe('rows with problems', () => {
  const bad = () =>
    csv([
      row(1),
      row(2, { tensile_strength_mpa: 'seventy' }),
      row(3, { family: 'unobtainium', condition: '' }),
      row(4, { service_temp_min_c: 80, service_temp_max_c: 10 }),
      row(5, { poissons_ratio: 0.7, elongation_pct: 140 }),
      row(6, { material: 'Cast acrylic (PMMA)', family: 'glass' }),
      row(7, { tensile_yield_mpa: 90 }),
      row(8, { transparent: 'perhaps', reference_year: '20x6' }),
      row(9, { tensile_strength_mpa: '1,200' }),
      row(10),
    ]);

  it('previews each problem by row and column, counting the valid rows', async () => {
    const res = await upload(librarian, '/api/library/import/preview', bad());
    expect(res.status).toBe(200);
    const preview = res.body as ImportPreviewDto;
    expect(preview.rows).toBe(10);
    expect(preview.valid).toBe(2);
    const by = (r: number) => preview.issues.filter((i) => i.row === r).map((i) => i.field).sort();
    expect(by(1)).toEqual([]);
    expect(by(2)).toEqual(['tensile_strength_mpa']);
    expect(by(3)).toEqual(['condition', 'family']);
    expect(by(4)).toEqual(['service_temp_max_c']);
    expect(by(5)).toEqual(['elongation_pct', 'poissons_ratio']);
    expect(by(6)).toEqual(['family']);
    expect(by(7)).toEqual(['tensile_yield_mpa']);
    expect(by(8)).toEqual(['reference_year', 'transparent']);
    expect(by(9)).toEqual(['tensile_strength_mpa']);
    expect(preview.issueCount).toBe(preview.issues.length);
    expect(preview.issues.find((i) => i.row === 2)?.message).toMatch(/must be a number/);
    expect(preview.issues.find((i) => i.row === 6)?.message).toMatch(/Cast acrylic \(PMMA\).*acrylic/);
  });

  it('refuses the import with 400 "import_invalid", naming rows.N.column, and writes nothing', async () => {
    const before = await counts();
    const res = await upload(librarian, '/api/library/import', bad());
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import_invalid');
    expect(res.body.error.fields['rows.2.tensile_strength_mpa']).toMatch(/must be a number/);
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining(['rows.3.family', 'rows.3.condition', 'rows.4.service_temp_max_c', 'rows.6.family', 'rows.8.transparent']),
    );
    expect(res.body.error.message).toMatch(/nothing was imported/);
    expect(await counts()).toEqual(before);
  });

  it('skips blank lines and counts every row around them', async () => {
    const lines = [HEADER.join(','), '', ...[1, 2, 3, 4].flatMap((n) => [row(n).map(quote).join(','), '', ' , ,'])];
    const res = await upload(librarian, '/api/library/import/preview', `${lines.join('\n')}\n`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ rows: 4, valid: 4, issueCount: 0 });
    expect((res.body as ImportPreviewDto).sample.map((s) => s.row)).toEqual([1, 2, 3, 4]);
  });

  it('reports a row with the wrong number of fields', async () => {
    const file = `${HEADER.join(',')}\r\n${row(1).map(quote).join(',')}\r\n${row(2).slice(0, 5).map(quote).join(',')}\r\n`;
    const res = await upload(librarian, '/api/library/import/preview', file);
    expect(res.status).toBe(200);
    expect(res.body.issues).toEqual([{ row: 2, field: '_', message: `has 5 fields; the header has ${HEADER.length}` }]);
  });

  it('reports at most 500 issues but counts them all', async () => {
    const rows = Array.from({ length: 600 }, (_, i) => row(i + 1, { density_kg_m3: 'heavy' }));
    const res = await upload(librarian, '/api/library/import/preview', csv(rows));
    expect(res.status).toBe(200);
    expect(res.body.issues).toHaveLength(500);
    expect(res.body.issueCount).toBe(600);
    const refused = await upload(librarian, '/api/library/import', csv(rows));
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toHaveLength(500);
  });
});

describe('issues in one round, structured', () => {
  // One row with a cell that cannot be read, a value the schema refuses, two cross-field errors
  // and a family that contradicts the catalogue's material of the same name.
  const mixed = () =>
    csv([
      row(1, { density_kg_m3: 'heavy', family: 'glass', poissons_ratio: 0.7, tensile_yield_mpa: 90, service_temp_min_c: 80, service_temp_max_c: 10 }),
      row(2),
    ]);

  it('previews cell errors and cross-field errors of a row together', async () => {
    const res = await upload(librarian, '/api/library/import/preview', mixed());
    expect(res.status).toBe(200);
    const preview = res.body as ImportPreviewDto;
    expect(preview).toMatchObject({ rows: 2, valid: 1, issueCount: 5 });
    expect(preview.issues.map((i) => [i.row, i.field]).sort()).toEqual([
      [1, 'density_kg_m3'],
      [1, 'family'],
      [1, 'poissons_ratio'],
      [1, 'service_temp_max_c'],
      [1, 'tensile_yield_mpa'],
    ]);
    expect(preview.issues.find((i) => i.field === 'tensile_yield_mpa')!.message).toBe('Tensile yield cannot exceed tensile strength');
    expect(preview.issues.find((i) => i.field === 'family')!.message).toMatch(/Cast acrylic \(PMMA\).*acrylic.*in the catalogue/);
  });

  it('refuses the import with the same issues as structured rows beside the fields', async () => {
    const preview = (await upload(librarian, '/api/library/import/preview', mixed())).body as ImportPreviewDto;
    const res = await upload(librarian, '/api/library/import', mixed());
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import_invalid');
    expect(res.body.error.issues).toEqual(preview.issues);
    expect(res.body.error.issueCount).toBe(5);
    expect(res.body.error.fields['rows.1.tensile_yield_mpa']).toBe('Tensile yield cannot exceed tensile strength');
  });
});

describe('the column list', () => {
  it('stores every column of an imported row at its draft path, converted to SI', async () => {
    const cells = row(41, { tensile_yield_mpa: 65, shear_yield_mpa: 37.5, reference_identifier: 'HSMW-TR-0241' });
    const res = await upload(librarian, '/api/library/import', csv([cells]));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const set = (await librarian.get(`/api/library/sets/${res.body.ids[0]}`)).body as LibrarySetDto;
    const at = (path: string) => path.split('.').reduce<unknown>((node, key) => (node as Record<string, unknown> | null)?.[key], set);
    let checked = 0;
    IMPORT_COLUMNS.forEach((column, i) => {
      const unit = unitOfColumn(column);
      const cell = cells[i];
      if (!cell) return;
      for (const { path, onlyWith } of targetsOf(column)) {
        if (onlyWith && at(onlyWith) == null) continue;
        if (column.cell === 'number') expect(at(path) as number, `${column.name} → ${path}`).toBeCloseTo(unit ? unit.toSI(Number(cell)) : Number(cell), 6);
        else if (column.cell === 'integer') expect(at(path), `${column.name} → ${path}`).toBe(Number(cell));
        else if (column.cell === 'yes-no') expect(at(path), `${column.name} → ${path}`).toBe(cell === 'yes');
        else expect(at(path), `${column.name} → ${path}`).toBe(cell);
        checked++;
      }
    });
    expect(checked).toBeGreaterThan(25);
    expect(set.youngsModulus).toBe(3.1e9);
    expect(set.shearYield).toBe(37.5e6);
  });
});

describe('statuses, test details and points', () => {
  // Row 1: confirmed against its test report, one value derived, one from another source, each
  // strength with its own method; row 2: demo data with a confirmed exception.
  const rows = () => [
    row(51, {
      reference_identifier: 'HSMW-TR-0251',
      test_method: 'ASTM D638',
      test_temperature_c: 23,
      compressive_strength_test_method: 'ASTM D695',
      compressive_yield_test_method: 'ASTM D695',
      shear_strength_test_method: 'ASTM D732',
      shear_strength_test_temperature_c: -2,
      density_basis: 'typical',
      density_test_method: 'ASTM D792',
      status: 'confirmed',
      status_location: 'Table 2',
      compressive_yield_status: 'derived',
      compressive_yield_rule: 'taken as 0.95 of the compressive strength',
      luminous_transmittance_location: 'Figure 3',
      luminous_transmittance_source: 'HSMW-TR-0250, optical annex',
      temperature_factors: '-20:1.15; 23:1; 50:0.8',
      sustained_load_factors: '0:1; 1000:0.75; 100000:0.6',
      cyclic_factors: '1:1; 1000:0.85; 10000:0.7',
      temperature_factors_location: 'Figure 5',
      sustained_load_factors_status: 'recalled',
      cyclic_factors_status: 'demo',
    }),
    row(52, { reference_identifier: 'HSMW-TR-0252', status: 'demo', youngs_modulus_status: 'confirmed', youngs_modulus_location: 'Table 4, p. 7', cyclic_factors: '1:1; 500:0.9' }),
  ];

  it('imports them and gives each back from GET /api/library/sets/:id exactly as the file said, in SI', async () => {
    const res = await upload(librarian, '/api/library/import', csv(rows()));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const [first, second] = await Promise.all(res.body.ids.map(async (id: number) => (await librarian.get(`/api/library/sets/${id}`)).body as LibrarySetDto));

    const strength = (testMethod: string, temperature = 23) => ({ basis: 'minimum', testMethod, temperature });
    expect(first.valueDetails).toEqual({
      density: { basis: 'typical', testMethod: 'ASTM D792' },
      tensileStrength: strength('ASTM D638'),
      compressiveStrength: strength('ASTM D695'),
      compressiveYield: strength('ASTM D695'),
      shearStrength: strength('ASTM D732', -2),
    });
    const confirmed = { status: 'confirmed', location: 'Table 2' };
    expect(first.provenance).toEqual({
      density: confirmed,
      youngsModulus: confirmed,
      poissonsRatio: confirmed,
      tensileStrength: confirmed,
      compressiveStrength: confirmed,
      compressiveYield: { status: 'derived', rule: 'taken as 0.95 of the compressive strength' },
      shearStrength: confirmed,
      elongation: confirmed,
      luminousTransmittance: { status: 'confirmed', location: 'Figure 3', source: 'HSMW-TR-0250, optical annex' },
      serviceTemperature: confirmed,
      temperatureFactors: { status: 'confirmed', location: 'Figure 5' },
      sustainedLoadFactors: { status: 'recalled' },
      cyclicFactors: { status: 'demo' },
    });
    expect(first.temperatureFactors).toEqual([
      { temperature: -20, factor: 1.15 },
      { temperature: 23, factor: 1 },
      { temperature: 50, factor: 0.8 },
    ]);
    expect(first.sustainedLoadFactors).toEqual([
      { hours: 0, factor: 1 },
      { hours: 1000, factor: 0.75 },
      { hours: 100000, factor: 0.6 },
    ]);
    expect(first.cyclicFactors).toEqual([
      { cycles: 1, factor: 1 },
      { cycles: 1000, factor: 0.85 },
      { cycles: 10000, factor: 0.7 },
    ]);

    expect(second.provenance.youngsModulus).toEqual({ status: 'confirmed', location: 'Table 4, p. 7' });
    const others = Object.entries(second.provenance!).filter(([k]) => k !== 'youngsModulus');
    expect(others.map(([k]) => k).sort()).toEqual(['compressiveStrength', 'compressiveYield', 'cyclicFactors', 'density', 'elongation', 'luminousTransmittance', 'poissonsRatio', 'serviceTemperature', 'shearStrength', 'tensileStrength']);
    for (const [k, entry] of others) expect(entry, k).toEqual({ status: 'demo' });
    expect(second.valueDetails.tensileStrength).toEqual({ basis: 'minimum' });
    expect(second.sustainedLoadFactors).toEqual([]);
  });

  it('previews how many values of each row are confirmed, and whether it is demo data', async () => {
    const res = await upload(librarian, '/api/library/import/preview', csv(rows()));
    expect(res.status).toBe(200);
    expect((res.body as ImportPreviewDto).sample.map((s) => s.status)).toEqual([
      { confirmed: 10, total: 13, demo: true },
      { confirmed: 1, total: 11, demo: true },
    ]);
  });

  it('refuses a confirmed value without a location with 400 naming the row and column, and writes nothing', async () => {
    const file = csv([rows()[0], row(53, { status: 'demo', shear_strength_status: 'confirmed' }), row(54, { status: 'confirmed' }), row(55, { status: 'derived', status_rule: 'x' })]);
    const before = await counts();
    const res = await upload(librarian, '/api/library/import', file);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import_invalid');
    expect(res.body.error.fields).toEqual({
      'rows.2.shear_strength_location': 'is required for a confirmed value (table, page, figure or clause)',
      'rows.3.status_location': 'is required for a confirmed value (table, page, figure or clause)',
      'rows.4.status_rule': 'must have at least 2 characters',
    });
    expect(res.body.error.issueCount).toBe(3);
    expect(await counts()).toEqual(before);
  });

  it('refuses malformed point lists with the row, the column and the part that is not a point', async () => {
    const file = csv([row(56), row(57), row(58), row(59, { temperature_factors: '-20:1.15; 23-1; 50:0.8', cyclic_factors: '1000:0' })]);
    const res = await upload(librarian, '/api/library/import/preview', file);
    expect(res.status).toBe(200);
    expect((res.body as ImportPreviewDto).issues).toEqual([
      { row: 4, field: 'temperature_factors', message: "'23-1' is not temperature:factor (write the points as temperature:factor, separated by semicolons)" },
      { row: 4, field: 'cyclic_factors', message: 'point 1: factor must be greater than zero' },
    ]);
  });
});

describe('files that cannot be read', () => {
  // A PNG signature and header (PNG specification, ISO/IEC 15948, section 5.2): binary, with NUL bytes.
  const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), Buffer.from('IHDR'), Buffer.alloc(64, 7)]);
  // "Polycarbonate, clear, éprouvette" in ISO-8859-1: é is the single byte 0xE9, invalid as UTF-8 (RFC 3629).
  const latin1 = Buffer.concat([Buffer.from(`${HEADER.join(',')}\r\n`), Buffer.from(row(1, { condition: 'Polycarbonate, clear, éprouvette' }).map(quote).join(','), 'latin1')]);

  it.each([
    ['binary data', png, 'not_text'],
    ['Latin-1 bytes', latin1, 'not_utf8'],
    ['an empty file', Buffer.alloc(0), 'empty_file'],
    ['only blank lines', Buffer.from('\r\n\r\n  \r\n'), 'empty_file'],
    ['a header and no rows', Buffer.from(`${HEADER.join(',')}\r\n`), 'no_rows'],
    ['JSON', Buffer.from('{"material": "Cast acrylic (PMMA)", "tensile": 70}\n'), 'not_csv'],
    ['semicolons for commas', Buffer.from(`${HEADER.join(';')}\n${row(1).join(';')}\n`), 'not_csv'],
    ['an unclosed quote', Buffer.from(`${HEADER.join(',')}\n"Cast acrylic (PMMA),acrylic\n`), 'not_csv'],
    ['a column the template lacks', Buffer.from(csv([[...row(1), 'blue']], [...HEADER, 'colour'])), 'unknown_columns'],
  ])('refuses %s with 400 and writes nothing', async (_label, content, code) => {
    const before = await counts();
    for (const path of ['/api/library/import/preview', '/api/library/import']) {
      const res = await upload(librarian, path, content);
      expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBe(400);
      expect(res.body.error.code).toBe(code);
    }
    expect(await counts()).toEqual(before);
  });

  it('names the missing required columns', async () => {
    const header: string[] = HEADER.filter((h) => h !== 'shear_strength_mpa' && h !== 'basis');
    const body = row(1).filter((_, i) => header.includes(HEADER[i]));
    const res = await upload(librarian, '/api/library/import/preview', csv([body], header));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('missing_columns');
    expect(res.body.error.message).toBe('The file lacks required columns: basis, shear_strength_mpa.');
  });

  it('accepts a file without the optional columns', async () => {
    const required = IMPORT_COLUMNS.filter((c) => c.required).map((c) => c.name);
    const body = row(1).filter((_, i) => (required as string[]).includes(HEADER[i]));
    const res = await upload(librarian, '/api/library/import/preview', csv([body], required));
    expect(res.status).toBe(200);
    expect(res.body.valid).toBe(1);
  });

  it('answers 400 without a file, or with the file in another field', async () => {
    const none = await librarian.post('/api/library/import/preview').send({});
    expect(none.status).toBe(400);
    const other = await librarian.post('/api/library/import/preview').attach('upload', Buffer.from(csv([row(1)])), 'blanks.csv');
    expect(other.status).toBe(400);
  });

  it('refuses a file over the size limit with 413 "too_large"', async () => {
    const before = await counts();
    const big = Buffer.alloc(IMPORT_MAX_BYTES + 1, 0x41);
    const res = await upload(librarian, '/api/library/import', big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect(await counts()).toEqual(before);
  });
});

describe('the largest file allowed', () => {
  it(`previews and imports ${IMPORT_MAX_ROWS} rows in one transaction, and refuses one row more`, { timeout: 180_000 }, async () => {
    const file = Buffer.from(manyRows(IMPORT_MAX_ROWS));
    expect(file.length).toBeLessThan(IMPORT_MAX_BYTES);

    const before = await counts();
    let t = performance.now();
    const preview = await upload(librarian, '/api/library/import/preview', file, 'fifty-thousand.csv');
    const previewMs = performance.now() - t;
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ rows: IMPORT_MAX_ROWS, valid: IMPORT_MAX_ROWS, issueCount: 0 });
    expect(await counts()).toEqual(before);

    const tooMany = Buffer.from(manyRows(IMPORT_MAX_ROWS + 1));
    for (const path of ['/api/library/import/preview', '/api/library/import']) {
      const res = await upload(librarian, path, tooMany);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('too_many_rows');
    }
    expect(await counts()).toEqual(before);

    const draftsBefore = await PropertySet.count({ where: { status: 'draft', draftedById: librarianId } });
    t = performance.now();
    const res = await upload(librarian, '/api/library/import', file, 'fifty-thousand.csv');
    const importMs = performance.now() - t;
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    expect(res.body.created).toBe(IMPORT_MAX_ROWS);
    expect(new Set(res.body.ids).size).toBe(IMPORT_MAX_ROWS);
    expect(await PropertySet.count({ where: { status: 'draft', draftedById: librarianId } })).toBe(draftsBefore + IMPORT_MAX_ROWS);
    expect(await AuditEntry.count({ where: { action: 'import' } })).toBeGreaterThanOrEqual(1);
    console.log(`[import timing] ${IMPORT_MAX_ROWS} rows, ${(file.length / 1024 / 1024).toFixed(1)} MB: preview ${Math.round(previewMs)} ms, import ${Math.round(importMs)} ms`);
  });
});
