/**
 * Demo materials and load cases of the Harrow Sound scenario shared by the evaluation tests (not
 * used by the engine itself).
 */
import type { Component, LoadCaseInput } from '../schemas/evaluate';
import type { CandidateMaterial } from './types';

// ---------------------------------------------------------------------------------------------
// Harrow Sound demo materials (values as in REFERENCES.md "Typical properties"; demo only)
// ---------------------------------------------------------------------------------------------
export const acrylic: CandidateMaterial = {
  name: 'Cast acrylic, PVHO-1 minimum properties',
  family: 'acrylic',
  density: 1190,
  youngsModulus: 2.76e9,
  poissonsRatio: 0.37,
  tensileStrength: 62e6,
  compressiveStrength: 103e6,
  compressiveYield: 103e6,
  shearStrength: 55e6,
  serviceTemperature: { min: -18, max: 66 },
  temperatureFactors: [
    { temperature: 0, factor: 1.15 },
    { temperature: 21, factor: 1 },
    { temperature: 32, factor: 0.85 },
    { temperature: 66, factor: 0.5 },
  ],
  sustainedLoadFactors: [
    { hours: 0.1, factor: 1 },
    { hours: 1000, factor: 0.6 },
    { hours: 100000, factor: 0.45 },
  ],
  cyclicFactors: [
    { cycles: 1, factor: 1 },
    { cycles: 10000, factor: 0.75 },
  ],
};
export const titanium: CandidateMaterial = {
  name: 'Titanium alloy, annealed plate',
  propertySetId: 7,
  family: 'titanium-alloy',
  density: 4430,
  youngsModulus: 114e9,
  poissonsRatio: 0.31,
  tensileStrength: 896e6,
  tensileYield: 827e6,
  compressiveStrength: 896e6,
  compressiveYield: 827e6,
  shearStrength: 550e6,
};
export const aluminium: CandidateMaterial = {
  name: 'Aluminium alloy 7075-T6, typical',
  propertySetId: 3,
  family: 'aluminium-alloy',
  density: 2810,
  youngsModulus: 71.7e9,
  poissonsRatio: 0.33,
  tensileStrength: 572e6,
  tensileYield: 503e6,
  compressiveStrength: 572e6,
  compressiveYield: 503e6,
  shearStrength: 331e6,
};
export const sapphire: CandidateMaterial = {
  name: 'Sapphire, c-plane window grade',
  family: 'sapphire-alumina',
  density: 3980,
  youngsModulus: 345e9,
  poissonsRatio: 0.29,
  tensileStrength: 400e6,
  compressiveStrength: 2000e6,
  shearStrength: 300e6,
};
export const glass: CandidateMaterial = {
  name: 'Borosilicate glass',
  family: 'glass',
  density: 2230,
  youngsModulus: 64e9,
  poissonsRatio: 0.2,
  tensileStrength: 40e6,
  compressiveStrength: 1000e6,
  shearStrength: 40e6,
};
export const demo = [acrylic, titanium, aluminium, sapphire, glass];

export const chamberViewport: LoadCaseInput = {
  pressure: { value: 5e5 }, // 5 bar hyperbaric treatment chamber
  temperature: { min: 15, max: 40 },
  sustainedHours: 2000,
  cycles: 3000,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.03, edge: 'simply-supported' },
};
export const cameraCone: LoadCaseInput = {
  pressure: { depth: 4000, latitude: 42, water: 'sea' }, // 4,000 m survey vehicle camera housing
  temperature: { min: 1, max: 25 },
  sustainedHours: 500,
  cycles: 400,
  component: { type: 'conical-frustum', minorDiameter: 0.05, thickness: 0.06, includedAngle: 90 },
};
export const hullSphere: LoadCaseInput = {
  pressure: { depth: 1200, latitude: 56, water: 'sea' }, // two-person submersible rated to 1,200 m
  temperature: { min: 0, max: 30 },
  sustainedHours: 1000,
  cycles: 1000,
  targetSafetyFactor: 1.5,
  component: { type: 'sphere', innerRadius: 0.8, thickness: 0.03 },
};
export const hullBay: LoadCaseInput = {
  pressure: { depth: 1200, latitude: 56, water: 'sea' },
  temperature: { min: 0, max: 30 },
  sustainedHours: 1000,
  cycles: 1000,
  targetSafetyFactor: 1.5,
  component: { type: 'cylinder', innerRadius: 0.8, thickness: 0.025, length: 0.7 },
};
export const loadCases = { chamberViewport, cameraCone, hullSphere, hullBay };

export const withThickness = (lc: LoadCaseInput, thickness: number): LoadCaseInput => ({
  ...lc,
  component: { ...lc.component, thickness } as Component,
});
