// Small console helpers shared by the infra scripts (Node built-ins only: they run before `npm ci`).
const t0 = Date.now();
const elapsed = () => `${((Date.now() - t0) / 1000).toFixed(1)}s`;

export const step = (message) => console.log(`\u25b8 ${message} [${elapsed()}]`);
export const info = (message) => console.log(`  ${message}`);
export const fail = (message) => console.error(`\u2716 ${message}`);

/** An error whose message is the one clear line shown to the person running the script. */
export class InfraError extends Error {}
