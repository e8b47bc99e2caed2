// Public exports of @roundbook/geomath. Contract: shared/design/geomath-contract.md.
export * from './types.js';
export { EPSILON, normalizeAzimuth, azimuthDifference, sinDeg, cosDeg } from './math.js';
export {
  dot,
  cross,
  norm,
  normalize,
  lineToVector,
  vectorToLine,
  planeNormal,
  dipVector,
  strikeVector,
} from './vector.js';
export { parsePlane, parseLine, formatPlane } from './notation.js';
export type { PlaneNotation } from './notation.js';
export { poleOf, planeOfPole, rightHandStrike } from './orientation.js';
export {
  intersectionOf,
  angleBetweenLines,
  angleBetweenPlanes,
  apparentDip,
  planeFromApparentDips,
  axisToLine,
} from './angles.js';
export { project, unproject, greatCircle, smallCircle } from './projection.js';
export type { Net } from './projection.js';
export {
  fisherStatistics,
  terzaghiWeight,
  terzaghiWeightFor,
  terzaghiWeights,
  TERZAGHI_SAMPLINGS,
  TERZAGHI_SAMPLING_LABELS,
  TERZAGHI_DEFAULT_CAP,
} from './statistics.js';
export type {
  FisherResult,
  TerzaghiSampling,
  TerzaghiOptions,
  TerzaghiWeights,
  WeightingUsed,
} from './statistics.js';
export {
  densityGrid,
  densityContours,
  densityLegend,
  rawDensity,
  exponentialK,
  kambFraction,
  DENSITY_UNITS,
} from './density.js';
export type { DensityGrid, DensityMethod, DensityContour, DensityUnits } from './density.js';
export { findSets, SET_SEPARATION, SET_SIGNIFICANCE } from './sets.js';
export type { JointSet } from './sets.js';
export {
  gradientPercentToDegrees,
  gradientDegreesToPercent,
  driveOf,
  formatChainage,
  parseChainage,
  type ChainageStyle,
} from './alignment.js';
export {
  CHAINAGE_SENSES,
  alignmentLength,
  alignmentPointAt,
  chainageAhead,
  chainageSign,
  distanceAheadOf,
  driveAt,
  driveBearingAt,
  positionAt,
  straightAlignment,
} from './heading-alignment.js';
export type {
  AlignmentPoint,
  AlignmentSegment,
  ChainageSense,
  HeadingAlignment,
} from './heading-alignment.js';
export {
  STRENGTH_GRADES,
  WEATHERING_GRADES,
  isGrade,
  type GradeRow,
  type GroundScale,
} from './ground-scales.js';
export * from './rock-mass.js';
