import type { QLocation, Rmr89Roughness, Rmr89WaterCondition, Rmr89Weathering } from '@roundbook/geomath';
import type {
  JointKind,
  JointWater,
  JrcMethod,
  PlaneNotation,
  RoundStatus,
  Shift,
  Stage,
} from '@/features/rounds/api/types';

export const stageLabels: Record<Stage, string> = {
  'full-face': 'Full face',
  'top-heading': 'Top heading',
  bench: 'Bench',
  invert: 'Invert',
};

export const statusLabels: Record<RoundStatus, string> = {
  draft: 'Draft',
  submitted: 'Submitted',
  confirmed: 'Confirmed',
  returned: 'Returned',
};

export const shiftLabels: Record<Shift, string> = { day: 'Day shift', night: 'Night shift' };

export const jointKindLabels: Record<JointKind, string> = {
  joint: 'Joint',
  bedding: 'Bedding',
  foliation: 'Foliation',
  fault: 'Fault',
  'shear-zone': 'Shear zone',
  vein: 'Vein',
  contact: 'Contact',
};

export const jointKinds = Object.keys(jointKindLabels) as JointKind[];

export const notationLabels: Record<PlaneNotation, string> = {
  'dip-direction/dip': 'Dip direction / dip',
  'dip/dip-direction': 'Dip / dip direction',
  'strike/dip-rhr': 'Strike / dip (right hand)',
};

export const notations = Object.keys(notationLabels) as PlaneNotation[];

export const waterLabels: Record<JointWater, string> = {
  dry: 'Dry',
  damp: 'Damp',
  wet: 'Wet',
  dripping: 'Dripping',
  flowing: 'Flowing',
};

export const jrcMethodLabels: Record<JrcMethod, string> = {
  'profile-comb': 'Profile gauge',
  'tilt-test': 'Tilt test',
  visual: 'By eye',
};

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
