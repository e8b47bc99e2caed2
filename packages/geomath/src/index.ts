// Public exports of @roundbook/geomath. Contract: shared/design/geomath-contract.md.
export * from './types.js';
export { EPSILON, normalizeAzimuth, azimuthDifference } from './math.js';
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
export * from './rock-mass.js';
