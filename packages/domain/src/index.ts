// Public exports of @roundbook/domain: the round's assessment, the vocabulary and the formatters, composed
// from packages/geomath. Pure TypeScript; used by the browser, the API and the report renderers alike.
export * from './vocabulary.js';
export * from './format.js';
export * from './ratings.js';
export * from './sets.js';
export * from './features.js';
export * from './support.js';
export * from './water.js';
export * from './triggers.js';
export * from './acceptances.js';
export * from './assess-round.js';
export * from './heading.js';
export * from './ground.js';
export * from './governing.js';
export * from './hazards.js';
export * from './sketch.js';
export * from './support-record.js';
export * from './sketch-svg.js';
export * from './sketch-frame.js';
export * from './look-ahead.js';
export * from './round-changes.js';
export * from './notices.js';
export * from './carried.js';
export * from './roof-wedges.js';
