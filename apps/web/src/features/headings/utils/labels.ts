import type { ChainageStyle, ExcavationStage, ProfileShape } from '@/api/contract';

export const profileShapeLabels: Record<ProfileShape, string> = {
  circular: 'Circular',
  horseshoe: 'Horseshoe',
  'd-shaped': 'D-shaped',
  rectangular: 'Rectangular',
};

export const stageLabels: Record<ExcavationStage, string> = {
  'full-face': 'Full face',
  'top-heading': 'Top heading',
  bench: 'Bench',
  invert: 'Invert',
};

export const chainageStyleLabels: Record<ChainageStyle, string> = {
  'km+m': 'km + m (1+250.0)',
  metres: 'metres (1250.0)',
};

export const PROFILE_SHAPES = Object.keys(profileShapeLabels) as ProfileShape[];
export const STAGES = Object.keys(stageLabels) as ExcavationStage[];
