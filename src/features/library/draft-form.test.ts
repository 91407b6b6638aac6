import { describe, expect, it } from 'vitest';
import { checkDraftForm, convertDraftForm, emptyDraftForm, formFromSet, formPathFor, parseNumber, serverErrorsToForm, toDraftInput } from './draft-form';
import { harrowDraft } from './test-fixtures';
import type { LibrarySetDto } from '@shared/schemas/library';

describe('property-set editor form model', () => {
  it('shows a set in SI display units (MPa, GPa, %, °C) and builds the same SI draft back', () => {
    const form = formFromSet(harrowDraft(), 'SI');
    expect(form.tensileStrength).toBe('68.9476');
    expect(form.youngsModulus).toBe('3.1');
    expect(form.elongation).toBe('4.5');
    expect(form.tensileYield).toBe('');
    const check = checkDraftForm(form, 'SI');
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.draft.tensileStrength).toBeCloseTo(68.9476e6, 0);
    expect(check.draft.youngsModulus).toBeCloseTo(3.1e9, 0);
    expect(check.draft.elongation).toBeCloseTo(0.045, 9);
    expect(check.draft.tensileYield).toBeNull();
    expect(check.draft.materialId).toBe(7);
    expect(check.draft.referenceId).toBe(3);
    expect(check.draft.valueDetails.tensileStrength).toEqual({ basis: 'minimum', testMethod: 'ASTM D638', temperature: 23 });
    expect(check.draft.temperatureFactors).toEqual([
      { temperature: 0, factor: 1.12 },
      { temperature: 23, factor: 1 },
      { temperature: 50, factor: 0.8 },
    ]);
  });

  it('shows strengths in ksi and temperatures in °F for US customary, and saves them in SI', () => {
    const form = formFromSet(harrowDraft(), 'US');
    // 1 ksi = 6.894757 MPa and t/°F = 1.8·t/°C + 32 (NIST SP 811, appendix B).
    expect(Number(form.tensileStrength)).toBeCloseTo(10, 4);
    expect(Number(form.serviceTemperature.min)).toBeCloseTo(-4, 6);
    expect(Number(form.valueDetails.tensileStrength.temperature)).toBeCloseTo(73.4, 6);
    expect(Number(form.temperatureFactors[2].temperature)).toBeCloseTo(122, 6);
    form.tensileStrength = '11';
    const check = checkDraftForm(form, 'US');
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.draft.tensileStrength).toBeCloseTo(11 * 6.894757e6, -2);
    expect(check.draft.serviceTemperature.min).toBeCloseTo(-20, 6);
    expect(check.draft.temperatureFactors[2].temperature).toBeCloseTo(50, 6);
  });

  it('converts what is typed when the units switch, leaving text that is not a number alone', () => {
    const si = formFromSet(harrowDraft(), 'SI');
    si.compressiveYield = 'abc';
    const us = convertDraftForm(si, 'SI', 'US');
    expect(us.compressiveYield).toBe('abc');
    const back = convertDraftForm(us, 'US', 'SI');
    expect(Number(back.tensileStrength)).toBeCloseTo(68.9476, 4);
    expect(Number(back.serviceTemperature.max)).toBeCloseTo(60, 6);
    expect(back.poissonsRatio).toBe(si.poissonsRatio);
  });

  it('reports every required field of an empty form on that field', () => {
    const check = checkDraftForm(emptyDraftForm(), 'SI');
    expect(check.ok).toBe(false);
    if (check.ok) return;
    for (const field of ['materialId', 'referenceId', 'condition', 'density', 'youngsModulus', 'poissonsRatio', 'tensileStrength', 'compressiveStrength', 'shearStrength', 'serviceTemperature.min', 'serviceTemperature.max']) {
      expect(check.errors[field], field).toBeTruthy();
    }
    expect(check.errors.density).toBe('Enter a number');
    expect(check.errors.tensileYield).toBeUndefined();
  });

  it('refuses text that is not a number even in an optional field', () => {
    const form = formFromSet(harrowDraft(), 'SI');
    form.compressiveYield = '12O';
    const check = checkDraftForm(form, 'SI');
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.errors).toEqual({ compressiveYield: 'Enter a number' });
  });

  it('keeps a test method only with a basis, and a tensile yield only up to the tensile strength', () => {
    const form = formFromSet(harrowDraft(), 'SI');
    form.valueDetails.shearStrength = { basis: '', testMethod: 'ASTM D732', temperature: '' };
    form.tensileYield = '80';
    form.temperatureFactors[1].factor = '0';
    const check = checkDraftForm(form, 'SI');
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors['valueDetails.shearStrength.basis']).toMatch(/basis/);
    expect(check.errors.tensileYield).toBe('Tensile yield cannot exceed tensile strength');
    expect(check.errors['temperatureFactors.1.factor']).toBe('Must be greater than zero');
  });

  it('describes a new material and a new reference inline, or sends no reference at all', () => {
    const form = formFromSet(harrowDraft(), 'SI');
    form.materialMode = 'new';
    form.material = { name: 'Harrow test glass-ceramic', family: 'glass-ceramic', transparent: true, description: ' ' };
    form.referenceMode = 'new';
    form.reference = { kind: 'paper', title: 'Bearing strength of thick viewports', authors: '', year: '2024', identifier: '', location: 'p. 12', note: '' };
    const { input, errors } = toDraftInput(form, 'SI');
    expect(errors).toEqual({});
    expect(input.materialId).toBeUndefined();
    expect(input.material).toEqual({ name: 'Harrow test glass-ceramic', family: 'glass-ceramic', transparent: true, description: undefined });
    expect(input.referenceId).toBeUndefined();
    expect(input.reference).toMatchObject({ kind: 'paper', title: 'Bearing strength of thick viewports', year: 2024, location: 'p. 12' });
    expect(checkDraftForm(form, 'SI').ok).toBe(true);

    form.referenceMode = 'none';
    const none = toDraftInput(form, 'SI').input;
    expect(none.referenceId).toBeNull();
    expect(none.reference).toBeUndefined();
  });

  it('asks for the family and the title of a new material and reference', () => {
    const form = formFromSet(harrowDraft(), 'SI');
    form.materialMode = 'new';
    form.referenceMode = 'new';
    form.reference.year = '20x4';
    const check = checkDraftForm(form, 'SI');
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors['material.name']).toBe('Required');
    expect(check.errors['material.family']).toBe('Choose one of the options');
    expect(check.errors['reference.kind']).toBe('Choose one of the options');
    expect(check.errors['reference.title']).toBe('Required');
    expect(check.errors['reference.year']).toBe('Enter a number');
  });

  it('round-trips each value’s status claim, drops who confirmed it (the server keeps that), and sends nothing for a value not said', () => {
    const set = harrowDraft({
      provenance: {
        tensileStrength: { status: 'confirmed', location: 'Table 2', confirmedBy: { id: 3, name: 'Tamsin Oyelaran' }, confirmedAt: '2026-11-30T10:00:00.000Z' },
        shearStrength: { status: 'derived', rule: 'tensile yield/√3 (von Mises)' },
      },
    } as Partial<LibrarySetDto>);
    const form = formFromSet(set, 'SI');
    expect(form.provenance.tensileStrength).toEqual({ status: 'confirmed', location: 'Table 2', source: '', rule: '' });
    expect(form.provenance.density.status).toBe('');
    form.provenance.density = { status: 'demo', location: '', source: '', rule: '' };
    const check = checkDraftForm(form, 'SI');
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.draft.provenance).toEqual({
      tensileStrength: { status: 'confirmed', location: 'Table 2' },
      shearStrength: { status: 'derived', rule: 'tensile yield/√3 (von Mises)' },
      density: { status: 'demo' },
    });
    expect(formPathFor('draft.provenance.tensileStrength.location')).toBe('provenance.tensileStrength.location');
    expect(formPathFor('draft.provenance.density')).toBe('provenance.density.status');
  });

  it('maps the server’s field paths (POST and PUT bodies) onto the form', () => {
    expect(formPathFor('draft.tensileStrength')).toBe('tensileStrength');
    expect(formPathFor('draft.valueDetails.shearStrength')).toBe('valueDetails.shearStrength.basis');
    expect(formPathFor('cyclicFactors.3.cycles')).toBe('cyclicFactors.3.cycles');
    expect(formPathFor('draft.serviceTemperature')).toBe('serviceTemperature.min');
    expect(formPathFor('draft.reference')).toBe('referenceId');
    expect(formPathFor('lockVersion')).toBe('root');
    expect(serverErrorsToForm({ 'draft.material.name': 'A material of that name exists', lockVersion: 'stale' })).toEqual({
      'material.name': 'A material of that name exists',
      root: 'stale',
    });
  });

  it('reads numbers typed with a typographic minus or spaces, and nothing else', () => {
    expect(parseNumber(' \u221220 ')).toBe(-20);
    expect(parseNumber('1 190')).toBe(1190);
    expect(parseNumber('2e3')).toBe(2000);
    expect(parseNumber('')).toBeUndefined();
    expect(Number.isNaN(parseNumber('1,5'))).toBe(true);
    expect(Number.isNaN(parseNumber('0x10'))).toBe(true);
  });

  it('keeps stored SI values exactly when a set is saved from US customary units, and converts what was retyped', () => {
    const set = harrowDraft({ density: 1190, serviceTemperature: { min: -20.3, max: 60 } });
    const form = formFromSet(set, 'US');
    // Shown to six figures, 1190 kg/m³ comes back as 1189.99… without the stored value to go by.
    const loose = checkDraftForm(form, 'US');
    expect(loose.ok && loose.draft.density).not.toBe(1190);
    form.shearStrength = '9';
    const check = checkDraftForm(form, 'US', set);
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.draft.density).toBe(1190);
    expect(check.draft.tensileStrength).toBe(68.9476e6);
    expect(check.draft.serviceTemperature.min).toBe(-20.3);
    expect(check.draft.temperatureFactors[2]).toEqual({ temperature: 50, factor: 0.8 });
    // 9 ksi = 62.05 MPa (1 ksi = 6.894757 MPa, NIST SP 811, appendix B).
    expect(check.draft.shearStrength).toBeCloseTo(62.0528e6, -2);
  });
});
