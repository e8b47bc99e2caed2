// Rock-mass ratings, tunnel kinematics and look-ahead (issue 4). Re-exports only.
export type { RatingCaution, RatingCautionId } from './cautions.js';
export { RATING_CAUTIONS, ratingCaution } from './cautions.js';
export type { RatingBand } from './rating-bands.js';
export { inBand } from './rating-bands.js';
export type {
  QClass,
  QInput,
  QLocation,
  QParameter,
  QParameterTable,
  QResult,
  QTableRow,
  QWarning,
  QWarningCode,
  TableCheck,
} from './q-system.js';
export {
  Q_CLASSES,
  Q_EDITION,
  Q_JA_TABLE,
  Q_JN_TABLE,
  Q_JR_TABLE,
  Q_JW_TABLE,
  Q_RQD_TABLE,
  Q_SRF_TABLE,
  Q_TABLES,
  Q_TABLE_EDITION,
  jnRowForSets,
  jnSetCountWarning,
  nearestQRows,
  qClass,
  qValue,
} from './q-system.js';
export type { EsrRow, QSupportInput, QSupportResult } from './q-support.js';
export { ESR_RANGE, ESR_TABLE, qSupport } from './q-support.js';
export type {
  GoverningJointRecord,
  Rmr89ConditionWarning,
  Rmr89Class,
  Rmr89Condition,
  Rmr89Groundwater,
  Rmr89Infilling,
  Rmr89Input,
  Rmr89Orientation,
  Rmr89Result,
  Rmr89Roughness,
  Rmr89SimpleCondition,
  Rmr89Strength,
  Rmr89WaterCondition,
  Rmr89Weathering,
} from './rmr89.js';
export {
  RMR89_CLASSES,
  RMR89_CONDITION_SIMPLE,
  RMR89_EDITION,
  RMR89_INFILLING_HARD,
  RMR89_INFILLING_SOFT,
  RMR89_INFLOW,
  RMR89_NO_INFILLING_RATING,
  RMR89_PERSISTENCE,
  RMR89_PRESSURE_RATIO,
  RMR89_ROUGHNESS,
  RMR89_RQD,
  RMR89_SEPARATION,
  RMR89_SOFT_INFILL_GOVERNS_MM,
  RMR89_SOFT_INFILL_NOTE,
  RMR89_SPACING,
  RMR89_STRENGTH_IS50,
  RMR89_STRENGTH_UCS,
  RMR89_WATER_CONDITION,
  RMR89_WEATHERING,
  rmr89,
  rmr89Class,
  rmr89ConditionWarnings,
} from './rmr89.js';
export type {
  RmrOrientationAdjustment,
  RmrOrientationAssessment,
  RmrOrientationResult,
} from './rmr-orientation.js';
export {
  PARALLEL_LIMIT,
  PERPENDICULAR_LIMIT,
  RMR_ORIENTATION_RULE,
  RMR_TUNNEL_ADJUSTMENT,
  RMR_TUNNEL_ORIENTATION_CASES,
  rmrOrientationInTunnel,
} from './rmr-orientation.js';
export type { JvEdition, RqdEstimate } from './correlations.js';
export {
  GSI_FROM_RMR89_MIN,
  gsiFromRmr89,
  jvFromSpacings,
  rmrFromQBarton1995,
  rmrFromQBieniawski1976,
  rqdEstimateFromJv,
  rqdFromJv,
} from './correlations.js';
export type { TunnelFrame } from './tunnel-frame.js';
export { tunnelFrame } from './tunnel-frame.js';
export type {
  ExcavationSurface,
  KinematicFlag,
  KinematicMechanism,
  KinematicScreenInput,
  RoofWedgeResult,
  ScreenedPlane,
  SlidingCheck,
  SurfaceGeometry,
} from './kinematics.js';
export {
  LATERAL_LIMIT,
  planarSlidingOut,
  roofWedge,
  screenRound,
  surfaceFacing,
  wedgeSlidingOut,
} from './kinematics.js';
export type {
  Arrival,
  MappedPlane,
  MappedPlaneKind,
  PlaneCrossings,
  PlaneCrossingsInput,
  RoundArrival,
  RoundArrivalInput,
} from './look-ahead.js';
export { ALONG_TUNNEL_LIMIT, planeCrossings, roundsToCrownAndInvert, stageCrossings } from './look-ahead.js';
export type {
  ExcavationStage,
  ProfileInput,
  ProfileOutline,
  ProfilePoint,
  ProfileShape,
  StageGeometryInput,
  StagePart,
} from './profile.js';
export {
  EXCAVATION_STAGES,
  PROFILE_SHAPES,
  clipBetween,
  polygonArea,
  profileOutline,
  stagePart,
  stageParts,
} from './profile.js';
