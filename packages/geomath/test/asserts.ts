/** expectClose: numbers, vectors and flat objects within a tolerance (after d3-geo's assertInDelta). */
export function expectClose(actual: unknown, expected: unknown, tolerance = 1e-6, path = 'value'): void {
  if (typeof expected === 'number') {
    if (typeof actual !== 'number' || !Number.isFinite(actual) || Math.abs(actual - expected) > tolerance) {
      throw new Error(`${path}: expected ${expected} ± ${tolerance}, received ${String(actual)}`);
    }
    return;
  }
  if (Array.isArray(expected)) {
    if (!Array.isArray(actual) || actual.length !== expected.length) {
      throw new Error(`${path}: expected an array of ${expected.length}, received ${JSON.stringify(actual)}`);
    }
    expected.forEach((e, i) => expectClose(actual[i], e, tolerance, `${path}[${i}]`));
    return;
  }
  if (expected !== null && typeof expected === 'object') {
    if (actual === null || typeof actual !== 'object') {
      throw new Error(`${path}: expected an object, received ${JSON.stringify(actual)}`);
    }
    for (const [k, v] of Object.entries(expected)) {
      expectClose((actual as Record<string, unknown>)[k], v, tolerance, `${path}.${k}`);
    }
    return;
  }
  if (actual !== expected)
    throw new Error(`${path}: expected ${String(expected)}, received ${String(actual)}`);
}

/** Angular closeness of two azimuths in degrees, wrapping at 360. */
export function expectAzimuthClose(actual: number, expected: number, tolerance = 1e-6): void {
  let d = Math.abs((((actual - expected) % 360) + 360) % 360);
  if (d > 180) d = 360 - d;
  if (!(d <= tolerance)) throw new Error(`azimuth: expected ${expected} ± ${tolerance}, received ${actual}`);
}
