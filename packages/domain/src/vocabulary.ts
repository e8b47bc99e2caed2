// The words Roundbook shows for its codes: one place for the browser, the API, e-mails and PDFs.
// Codes are what the API stores; labels are what people read. Trade terms keep their usual names.

export const STAGES = ['full-face', 'top-heading', 'bench', 'invert'] as const;
export type Stage = (typeof STAGES)[number];
export const stageLabels: Record<Stage, string> = {
  'full-face': 'Full face',
  'top-heading': 'Top heading',
  bench: 'Bench',
  invert: 'Invert',
};

export const ROUND_STATUSES = ['draft', 'submitted', 'confirmed', 'returned'] as const;
export type RoundStatus = (typeof ROUND_STATUSES)[number];
export const statusLabels: Record<RoundStatus, string> = {
  draft: 'Draft',
  submitted: 'Submitted',
  confirmed: 'Confirmed',
  returned: 'Returned',
};

export const SHIFTS = ['day', 'night'] as const;
export type Shift = (typeof SHIFTS)[number];
export const shiftLabels: Record<Shift, string> = { day: 'Day shift', night: 'Night shift' };

export const JOINT_KINDS = [
  'joint',
  'bedding',
  'foliation',
  'fault',
  'shear-zone',
  'vein',
  'contact',
] as const;
export type JointKind = (typeof JOINT_KINDS)[number];
export const jointKindLabels: Record<JointKind, string> = {
  joint: 'Joint',
  bedding: 'Bedding',
  foliation: 'Foliation',
  fault: 'Fault',
  'shear-zone': 'Shear zone',
  vein: 'Vein',
  contact: 'Contact',
};
/** Kinds recorded as significant single features rather than set members (common practice). */
export const SINGLE_FEATURE_KINDS: readonly JointKind[] = ['fault', 'shear-zone'];

export const JOINT_WATER = ['dry', 'damp', 'wet', 'dripping', 'flowing'] as const;
export type JointWater = (typeof JOINT_WATER)[number];
export const waterLabels: Record<JointWater, string> = {
  dry: 'Dry',
  damp: 'Damp',
  wet: 'Wet',
  dripping: 'Dripping',
  flowing: 'Flowing',
};

export const JRC_METHODS = ['profile-comb', 'tilt-test', 'visual'] as const;
export type JrcMethod = (typeof JRC_METHODS)[number];
export const jrcMethodLabels: Record<JrcMethod, string> = {
  'profile-comb': 'Profile gauge',
  'tilt-test': 'Tilt test',
  visual: 'By eye',
};

export const PLANE_NOTATIONS = ['dip-direction/dip', 'dip/dip-direction', 'strike/dip-rhr'] as const;
export type PlaneNotationCode = (typeof PLANE_NOTATIONS)[number];
export const notationLabels: Record<PlaneNotationCode, string> = {
  'dip-direction/dip': 'Dip direction / dip',
  'dip/dip-direction': 'Dip / dip direction',
  'strike/dip-rhr': 'Strike / dip (right hand)',
};

export const PROJECT_ROLES = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];
export const roleLabels: Record<ProjectRole, string> = {
  admin: 'Project admin',
  geologist: 'Geologist',
  engineer: 'Engineer',
  supervisor: 'Shift supervisor',
  viewer: 'Read only',
};
/** A role code in words; unknown codes are shown as they are. */
export const roleLabel = (role: string): string =>
  (PROJECT_ROLES as readonly string[]).includes(role) ? roleLabels[role as ProjectRole] : role;

export const TRIGGER_LEVELS = ['green', 'amber', 'red'] as const;
export type TriggerLevel = (typeof TRIGGER_LEVELS)[number];
export const levelLabels: Record<TriggerLevel, string> = { green: 'Green', amber: 'Amber', red: 'Red' };
export const LEVEL_RANK: Record<TriggerLevel, number> = { green: 0, amber: 1, red: 2 };

export const PROFILE_SHAPES = ['circular', 'horseshoe', 'd-shaped', 'rectangular'] as const;
export type ProfileShape = (typeof PROFILE_SHAPES)[number];
export const profileShapeLabels: Record<ProfileShape, string> = {
  circular: 'Circular',
  horseshoe: 'Horseshoe',
  'd-shaped': 'D-shaped',
  rectangular: 'Rectangular',
};

export const CHAINAGE_STYLES = ['km+m', 'metres'] as const;
export type ChainageStyleCode = (typeof CHAINAGE_STYLES)[number];
export const chainageStyleLabels: Record<ChainageStyleCode, string> = {
  'km+m': 'km + m (1+250.0)',
  metres: 'metres (1250.0)',
};

/** Where the excavation cycle of a heading stands at shift change (the supervisor says; common practice). */
export const CYCLE_STAGES = ['drilling', 'charging', 'mucking', 'support', 'mapping'] as const;
export type CycleStage = (typeof CYCLE_STAGES)[number];
export const cycleStageLabels: Record<CycleStage, string> = {
  drilling: 'Drilling',
  charging: 'Charging',
  mucking: 'Mucking out',
  support: 'Installing support',
  mapping: 'Face mapping',
};

export const HANDOVER_STATUSES = ['sent', 'acknowledged'] as const;
export type HandoverStatus = (typeof HANDOVER_STATUSES)[number];
export const handoverStatusLabels: Record<HandoverStatus, string> = {
  sent: 'Waiting for acknowledgement',
  acknowledged: 'Acknowledged',
};
