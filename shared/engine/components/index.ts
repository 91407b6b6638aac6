/** Component models by component type. */
import type { Component } from '../../schemas/evaluate';
import type { ComponentModel } from './common';
import { conicalFrustumModel } from './conical-frustum';
import { cylinderModel } from './cylinder';
import { flatDiscModel } from './flat-disc';
import { ringStiffenedCylinderModel } from './ring-stiffened-cylinder';
import { sphereModel } from './sphere';
import { sphericalSectorModel } from './spherical-sector';

const MODELS = {
  'flat-disc': flatDiscModel,
  'conical-frustum': conicalFrustumModel,
  'spherical-sector': sphericalSectorModel,
  sphere: sphereModel,
  cylinder: cylinderModel,
  'ring-stiffened-cylinder': ringStiffenedCylinderModel,
} as const;

/** The model of a component (typed loosely: the caller passes the same component back in). */
export function modelFor(component: Component): ComponentModel<Component> {
  return MODELS[component.type] as unknown as ComponentModel<Component>;
}

export type { ComponentModel, ModeMaterial } from './common';
