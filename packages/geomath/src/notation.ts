// Parsing and display of plane and line orientations in the notations used in the trade.
// Conventions: methods.md §0–§1.1. Every failure is an OrientationError whose message names what is
// wrong and what was expected, so the UI can show it beside the input field.
import { normalizeAzimuth } from './math.js';
import { OrientationError } from './types.js';
import type { Line, Plane } from './types.js';

export type PlaneNotation = 'dip-direction/dip' | 'dip/dip-direction' | 'strike/dip-rhr';

/** Longest text accepted; real entries are a dozen characters. */
const MAX_LENGTH = 40;

const PLANE_EXAMPLES: Record<PlaneNotation, string> = {
  'dip-direction/dip': 'dip direction/dip such as 130/50',
  'dip/dip-direction': 'dip/dip direction such as 50/130',
  'strike/dip-rhr': 'right-hand-rule strike/dip such as 040/50',
};

type Token = { kind: 'number'; value: number; text: string } | { kind: 'letters'; text: string };

const DIRECTION_OF_LETTERS: Record<string, number> = {
  N: 0,
  NE: 45,
  E: 90,
  SE: 135,
  S: 180,
  SW: 225,
  W: 270,
  NW: 315,
};

const quote = (text: string): string =>
  `“${text.length > MAX_LENGTH ? text.slice(0, MAX_LENGTH) + '…' : text}”`;

/**
 * Splits text into numbers and letter groups. Accepted separators: "/", ",", "-", spaces; a degree sign
 * after a number is ignored; letters may be lower case.
 */
function tokenize(raw: string, what: string, expected: string): Token[] {
  const text = raw.trim();
  if (text.length === 0) {
    throw new OrientationError(`No ${what} given: enter ${expected}.`);
  }
  if (text.length > MAX_LENGTH) {
    throw new OrientationError(
      `The ${what} ${quote(text)} is too long (more than ${MAX_LENGTH} characters): enter ${expected}.`,
    );
  }
  const upper = text.toUpperCase().replace(/[°º]/g, ' ');
  const bad = /[^0-9.NESW\s/,-]/.exec(upper);
  if (bad) {
    const ch = text[bad.index] ?? bad[0];
    throw new OrientationError(
      `The ${what} ${quote(text)} contains “${ch}”, which is not allowed: use numbers, the letters N, E, S, W ` +
        `and the separators / , - or a space, as in ${expected}.`,
    );
  }
  const trimmed = upper.trim();
  if (/^[\s/,-]|[\s/,-]$/.test(trimmed)) {
    throw new OrientationError(
      `The ${what} ${quote(text)} starts or ends with a separator (negative angles are not used): enter ${expected}.`,
    );
  }
  const tokens: Token[] = [];
  for (const chunk of trimmed.split(/[\s/,-]+/)) {
    const re = /(\d+(?:\.\d+)?)|([NESW]+)/y;
    let at = 0;
    while (at < chunk.length) {
      re.lastIndex = at;
      const m = re.exec(chunk);
      if (!m) {
        throw new OrientationError(
          `The ${what} ${quote(text)} has “${chunk}”, which is not a number or a compass direction: enter ${expected}.`,
        );
      }
      if (m[1] !== undefined) {
        const value = Number(m[1]);
        if (!Number.isFinite(value)) {
          throw new OrientationError(
            `The number ${m[1]} in ${quote(text)} is not usable: enter ${expected}.`,
          );
        }
        const prev = tokens[tokens.length - 1];
        if (at > 0 && prev?.kind === 'number') {
          throw new OrientationError(
            `The ${what} ${quote(text)} has “${chunk}”, which is not a single number: enter ${expected}.`,
          );
        }
        tokens.push({ kind: 'number', value, text: m[1] });
      } else {
        tokens.push({ kind: 'letters', text: m[2] ?? '' });
      }
      at = re.lastIndex;
    }
  }
  return tokens;
}

function checkAzimuth(value: number, label: string): number {
  if (value > 360) {
    throw new OrientationError(
      `${label} ${value} is out of range: azimuths run from 0 to 360° clockwise from north.`,
    );
  }
  return normalizeAzimuth(value);
}

function checkDip(value: number, label = 'Dip', hint = ''): number {
  if (value > 90) {
    throw new OrientationError(
      `${label} ${value} is out of range: ${label.toLowerCase()} must be 0–90°.${hint}`,
    );
  }
  return value;
}

/** Quadrant bearing N a E, S a E, S a W, N a W → azimuth (methods.md §1.1). */
function bearingToAzimuth(from: string, angle: number, toward: string, whole: string): number {
  if (from !== 'N' && from !== 'S') {
    throw new OrientationError(
      `The bearing ${whole} must start with N or S (for example N30E or S45W), not “${from}”.`,
    );
  }
  if (toward !== 'E' && toward !== 'W') {
    throw new OrientationError(
      `The bearing ${whole} must end with E or W (for example N30E or S45W), not “${toward}”.`,
    );
  }
  if (angle > 90) {
    throw new OrientationError(
      `The bearing ${whole} is out of range: the angle of a quadrant bearing is 0–90° measured from N or S.`,
    );
  }
  if (from === 'N') return normalizeAzimuth(toward === 'E' ? angle : 360 - angle);
  return normalizeAzimuth(toward === 'E' ? 180 - angle : 180 + angle);
}

/** Signed angular difference b − a in (−180, 180]. */
function signedDifference(a: number, b: number): number {
  let d = (((b - a) % 360) + 360) % 360;
  if (d > 180) d -= 360;
  return d;
}

/**
 * A single dip letter names a dip direction only within this angle of it (common practice): N89E 40E is
 * refused, since E lies 89° from either side of that strike.
 */
export const SINGLE_LETTER_LIMIT = 67.5;

/**
 * Which letters may name a dip direction: the quadrant strictly containing it, or a single letter within
 * 67.5° (SINGLE_LETTER_LIMIT, included) of it.
 */
function letterFits(letters: string, dipDirection: number): boolean {
  const centre = DIRECTION_OF_LETTERS[letters];
  if (centre === undefined) return false;
  const d = Math.abs(signedDifference(centre, dipDirection));
  // A quadrant (two letters) must contain the dip direction strictly; on its edge the single letter is
  // the unambiguous name (strike N–S takes E or W, strike E–W takes N or S).
  return letters.length === 2 ? d < 45 - 1e-9 : d <= SINGLE_LETTER_LIMIT + 1e-9;
}

/** Name of a dip direction for display: a single letter on a cardinal direction, else the quadrant. */
function quadrantLabel(dipDirection: number): string {
  for (const [letters, centre] of Object.entries(DIRECTION_OF_LETTERS)) {
    if (letters.length === 1 && Math.abs(signedDifference(centre, dipDirection)) < 1e-9) return letters;
  }
  if (dipDirection < 90) return 'NE';
  if (dipDirection < 180) return 'SE';
  if (dipDirection < 270) return 'SW';
  return 'NW';
}

function resolveDipQuadrant(
  strike: number,
  dip: number,
  letters: string,
  original: string,
  strikeText: string,
  dipText: string,
): Plane {
  if (DIRECTION_OF_LETTERS[letters] === undefined) {
    throw new OrientationError(
      `The dip direction “${letters}” in ${quote(original)} is not a compass quadrant: use N, E, S, W, NE, SE, SW or NW.`,
    );
  }
  const right = normalizeAzimuth(strike + 90);
  const left = normalizeAzimuth(strike - 90);
  const fitsRight = letterFits(letters, right);
  const fitsLeft = letterFits(letters, left);
  if (fitsRight === fitsLeft) {
    const options = (dd: number): string => {
      const names = Object.keys(DIRECTION_OF_LETTERS)
        .filter((l) => letterFits(l, dd))
        .sort((a, b) => b.length - a.length);
      return `${formatAngle(dd, 3)}° (${names.join(', ').replace(/, ([^,]*)$/, ' or $1')})`;
    };
    const reading = (dd: number): string => {
      const names = Object.keys(DIRECTION_OF_LETTERS).filter((l) => letterFits(l, dd));
      // The nearest name: a single letter when one fits, else the quadrant.
      names.sort(
        (a, b) =>
          Math.abs(signedDifference(DIRECTION_OF_LETTERS[a], dd)) -
          Math.abs(signedDifference(DIRECTION_OF_LETTERS[b], dd)),
      );
      return `${strikeText} ${dipText}${names[0] ?? ''} (${formatAngle(dd, 3)}/${formatAngle(dip, 2)})`;
    };
    const why =
      letters.length === 1
        ? ` A single letter must lie within ${SINGLE_LETTER_LIMIT}° of the dip direction it names; ` +
          `${letters} is ${formatAngle(Math.min(Math.abs(signedDifference(DIRECTION_OF_LETTERS[letters], right)), Math.abs(signedDifference(DIRECTION_OF_LETTERS[letters], left))), 1)}° from the nearer side.`
        : '';
    throw new OrientationError(
      `The dip direction ${letters} does not fit the strike in ${quote(original)}: a plane striking ` +
        `${formatAngle(strike, 3)}° dips at right angles to its strike, toward ${options(right)} or ${options(left)}.` +
        `${why} Valid readings: ${reading(right)} or ${reading(left)}.`,
    );
  }
  return { dipDirection: fitsRight ? right : left, dip };
}

function describePlaneFormats(notation: PlaneNotation): string {
  return `${PLANE_EXAMPLES[notation]}, or strike, dip and dip quadrant such as N40E 50SE or 040/50SE`;
}

/**
 * Reads a plane. Two numbers are read in the given notation (default dip direction/dip); quadrant forms
 * are always recognised: "N30E 40SE", "N30E/40SE", "030/40SE", "030 40 SE" (strike, dip, dip quadrant).
 */
export function parsePlane(text: string, options?: { notation?: PlaneNotation }): Plane {
  const notation: PlaneNotation = options?.notation ?? 'dip-direction/dip';
  if (!(notation in PLANE_EXAMPLES)) throw new RangeError(`Unknown plane notation ${String(notation)}.`);
  const expected = describePlaneFormats(notation);
  if (typeof text !== 'string') throw new OrientationError(`No plane given: enter ${expected}.`);
  const tokens = tokenize(text, 'plane', expected);
  const shape = tokens.map((t) => (t.kind === 'number' ? 'n' : 'l')).join('');
  const num = (i: number): number => {
    const t = tokens[i];
    return t?.kind === 'number' ? t.value : 0;
  };
  const str = (i: number): string => tokens[i]?.text ?? '';

  if (shape === 'nn') {
    const [first, second] = [num(0), num(1)];
    switch (notation) {
      case 'dip-direction/dip': {
        const hint =
          second > 90 && first <= 90
            ? ` It looks like dip/dip direction (${str(0)}/${str(1)}); this field expects dip direction/dip, such as ${str(1)}/${str(0)}.`
            : '';
        const dip = checkDip(second, 'Dip', hint);
        return { dipDirection: checkAzimuth(first, 'Dip direction'), dip };
      }
      case 'dip/dip-direction': {
        const hint =
          first > 90 && second <= 90
            ? ` It looks like dip direction/dip (${str(0)}/${str(1)}); this field expects dip/dip direction, such as ${str(1)}/${str(0)}.`
            : '';
        const dip = checkDip(first, 'Dip', hint);
        return { dipDirection: checkAzimuth(second, 'Dip direction'), dip };
      }
      case 'strike/dip-rhr': {
        const strike = checkAzimuth(first, 'Strike');
        return { dipDirection: normalizeAzimuth(strike + 90), dip: checkDip(second) };
      }
    }
  }
  if (shape === 'nnl') {
    const strike = checkAzimuth(num(0), 'Strike');
    return resolveDipQuadrant(strike, checkDip(num(1)), str(2), text, str(0), str(1));
  }
  if (shape === 'lnlnl') {
    const strike = bearingToAzimuth(str(0), num(1), str(2), `${str(0)}${str(1)}${str(2)}`);
    return resolveDipQuadrant(strike, checkDip(num(3)), str(4), text, `${str(0)}${str(1)}${str(2)}`, str(3));
  }
  if (['n', 'nl', 'ln', 'lnl', 'lnln'].includes(shape)) {
    throw new OrientationError(
      `The plane ${quote(text)} is incomplete: a quadrant strike needs a dip and a dip quadrant, as in N40E 50SE.`,
    );
  }
  throw new OrientationError(`The plane ${quote(text)} is not a recognised orientation: enter ${expected}.`);
}

/**
 * Reads a line: "124/50" (trend/plunge), "S56E 50" (quadrant bearing and plunge) or "50→124" / "50->124"
 * (plunge → trend).
 */
export function parseLine(text: string): Line {
  const expected =
    'trend/plunge such as 124/50, a bearing and plunge such as S56E 50, or plunge→trend such as 50→124';
  if (typeof text !== 'string') throw new OrientationError(`No line given: enter ${expected}.`);
  const arrow = /→|->/.exec(text);
  if (arrow) {
    const plungeText = text.slice(0, arrow.index);
    const trendText = text.slice(arrow.index + arrow[0].length);
    const p = tokenize(plungeText, 'plunge', expected);
    const t = tokenize(trendText, 'trend', expected);
    const [p0] = p;
    const [t0] = t;
    if (p.length !== 1 || t.length !== 1 || p0?.kind !== 'number' || t0?.kind !== 'number') {
      throw new OrientationError(
        `The line ${quote(text)} must be one plunge and one trend around the arrow, as in 50→124.`,
      );
    }
    return { trend: checkAzimuth(t0.value, 'Trend'), plunge: checkDip(p0.value, 'Plunge') };
  }
  const tokens = tokenize(text, 'line', expected);
  const shape = tokens.map((t) => (t.kind === 'number' ? 'n' : 'l')).join('');
  const num = (i: number): number => {
    const t = tokens[i];
    return t?.kind === 'number' ? t.value : 0;
  };
  const str = (i: number): string => tokens[i]?.text ?? '';
  if (shape === 'nn') {
    const plunge = checkDip(
      num(1),
      'Plunge',
      num(0) <= 90 && num(1) > 90 ? ` Lines are written trend/plunge, such as ${str(1)}/${str(0)}.` : '',
    );
    return { trend: checkAzimuth(num(0), 'Trend'), plunge };
  }
  if (shape === 'lnln') {
    const trend = bearingToAzimuth(str(0), num(1), str(2), `${str(0)}${str(1)}${str(2)}`);
    return { trend, plunge: checkDip(num(3), 'Plunge') };
  }
  if (shape === 'lnl') {
    throw new OrientationError(
      `The line ${quote(text)} has a bearing but no plunge: add the plunge, as in S56E 50.`,
    );
  }
  throw new OrientationError(`The line ${quote(text)} is not a recognised orientation: enter ${expected}.`);
}

/** Angle for display: at most one decimal, whole degrees without one, zero-padded to `digits`. */
function formatAngle(value: number, digits: number): string {
  const rounded = Math.round(value * 10) / 10;
  const whole = Math.floor(rounded);
  const tenth = Math.round((rounded - whole) * 10);
  const head = String(whole).padStart(digits, '0');
  return tenth === 0 ? head : `${head}.${tenth}`;
}

const roundTenth = (value: number): number => Math.round(value * 10) / 10;

/**
 * Writes a plane in the given notation (default dip direction/dip): "130/50", "50/130", "040/50" (strike
 * by the right-hand rule) or "N40E 50SE" (quadrant strike, dip, dip quadrant). Azimuths have three
 * digits, dips two; values are rounded to 0.1°.
 */
export function formatPlane(
  plane: Plane,
  notation: PlaneNotation | 'quadrant' = 'dip-direction/dip',
): string {
  if (
    !Number.isFinite(plane.dipDirection) ||
    !Number.isFinite(plane.dip) ||
    plane.dip < 0 ||
    plane.dip > 90
  ) {
    throw new OrientationError(
      `Cannot write the plane ${String(plane.dipDirection)}/${String(plane.dip)}: dip direction must be 0–360° and dip 0–90°.`,
    );
  }
  const dd = normalizeAzimuth(roundTenth(plane.dipDirection));
  const dip = formatAngle(plane.dip, 2);
  switch (notation) {
    case 'dip-direction/dip':
      return `${formatAngle(dd, 3)}/${dip}`;
    case 'dip/dip-direction':
      return `${dip}/${formatAngle(dd, 3)}`;
    case 'strike/dip-rhr':
      return `${formatAngle(normalizeAzimuth(dd - 90), 3)}/${dip}`;
    case 'quadrant': {
      const strike = normalizeAzimuth(dd - 90) % 180; // referred to north: [0, 180)
      const bearing =
        strike <= 90 ? `N${formatAngle(strike, 2)}E` : `N${formatAngle(roundTenth(180 - strike), 2)}W`;
      return `${bearing} ${dip}${quadrantLabel(dd)}`;
    }
  }
}
