import { describe, expect, it } from 'vitest';
import { shortCandidateLabels, splitCandidateName } from './candidate-name';

describe('splitCandidateName', () => {
  it('takes the last bracketed group as the condition, keeping brackets in the material name', () => {
    expect(splitCandidateName('Sapphire (single-crystal alumina) (Optical-grade single crystal, polished window)')).toEqual({
      material: 'Sapphire (single-crystal alumina)',
      condition: 'Optical-grade single crystal, polished window',
    });
  });

  it('keeps brackets inside the condition', () => {
    expect(splitCandidateName('Soda-lime silicate glass (float) (Chemically strengthened (ion-exchanged) float)')).toEqual({
      material: 'Soda-lime silicate glass (float)',
      condition: 'Chemically strengthened (ion-exchanged) float',
    });
    expect(splitCandidateName('Cast acrylic (PMMA) (Cast sheet, as supplied)').material).toBe('Cast acrylic (PMMA)');
  });

  it('leaves a name without a condition whole', () => {
    expect(splitCandidateName('Harrow trial resin')).toEqual({ material: 'Harrow trial resin', condition: '' });
    expect(splitCandidateName('(unbalanced')).toEqual({ material: '(unbalanced', condition: '' });
    expect(splitCandidateName('(only a condition)')).toEqual({ material: '(only a condition)', condition: '' });
  });
});

describe('shortCandidateLabels', () => {
  // Names as the seed catalogue writes them (data/catalogue.json), shortened here.
  const sets = [
    { propertySetId: 1, name: 'Cast acrylic (PMMA) (PVHO-grade cast sheet, as supplied; lot-certified minimums of the pressure-window standard)' },
    { propertySetId: 2, name: 'Cast acrylic (PMMA) (PVHO-grade cast sheet, typical values with temperature, static-fatigue and cyclic-fatigue dependence)' },
    { propertySetId: 3, name: 'Borosilicate glass 3.3 (Annealed, characteristic values of the basic-glass standard)' },
  ];

  it('names the designation and a short condition, with no bracket left open', () => {
    const [, , glass] = shortCandidateLabels(sets);
    expect(glass).toBe('Borosilicate glass 3.3 · Annealed…');
    for (const l of shortCandidateLabels(sets)) expect(l.split('(').length).toBe(l.split(')').length);
  });

  it('takes more of the condition where two acrylic sets would read the same', () => {
    const labels = shortCandidateLabels(sets);
    expect(new Set(labels).size).toBe(labels.length);
    expect(labels[0]).toMatch(/^Cast acrylic \(PMMA\) · PVHO-grade cast sheet, as/);
    expect(labels[1]).toMatch(/^Cast acrylic \(PMMA\) · PVHO-grade cast sheet, typical/);
  });

  it('adds the set number when two names are identical', () => {
    const labels = shortCandidateLabels([
      { propertySetId: 7, name: 'Sapphire (Optical grade)' },
      { propertySetId: 9, name: 'Sapphire (Optical grade)' },
    ]);
    expect(labels).toEqual(['Sapphire · Optical grade #7', 'Sapphire · Optical grade #9']);
  });
});
