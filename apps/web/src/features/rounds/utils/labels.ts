import { JOINT_KINDS, PLANE_NOTATIONS } from '@roundbook/domain';
import type { QLocation, Rmr89Roughness, Rmr89WaterCondition, Rmr89Weathering } from '@roundbook/geomath';
import type { JointKind, PlaneNotation } from '@/features/rounds/api/types';

// The words of Roundbook's codes come from packages/domain (one vocabulary for the browser, the API and
// the reports); only the Round screen's own choice words live here.
export {
  jointKindLabels,
  jrcMethodLabels,
  notationLabels,
  shiftLabels,
  stageLabels,
  statusLabels,
  waterLabels,
} from '@roundbook/domain';

export const jointKinds: JointKind[] = [...JOINT_KINDS];
export const notations: PlaneNotation[] = [...PLANE_NOTATIONS];

export const qLocationLabels: Record<QLocation, string> = {
  tunnel: 'In the tunnel (Jn as read)',
  intersection: 'At an intersection (3 × Jn)',
  portal: 'At a portal (2 × Jn)',
};

export const rmrRoughnessOptions: Rmr89Roughness[] = [
  'very rough',
  'rough',
  'slightly rough',
  'smooth',
  'slickensided',
];
export const rmrWeatheringOptions: Rmr89Weathering[] = [
  'unweathered',
  'slightly',
  'moderately',
  'highly',
  'decomposed',
];
export const rmrWaterOptions: Rmr89WaterCondition[] = [
  'completely dry',
  'damp',
  'wet',
  'dripping',
  'flowing',
];

/** Upper-case first letter, for table words shown as choices. */
export function sentence(text: string): string {
  return text.length === 0 ? text : text[0].toUpperCase() + text.slice(1);
}
