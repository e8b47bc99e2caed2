import { angleBetweenPlanes, OrientationError, parsePlane } from '@roundbook/geomath';
import type { JointKind, JointWater, JrcMethod, PlaneNotation } from '@/features/rounds/api/types';
import type { JointRow } from '@/features/rounds/schemas/round-form';
import { emptyJoint, numberOf } from '@/features/rounds/schemas/round-form';
import type { CsvRow } from '@/features/rounds/utils/csv';
import { parseCsv } from '@/features/rounds/utils/csv';
import {
  jointKindLabels,
  jrcMethodLabels,
  notationLabels,
  waterLabels,
} from '@/features/rounds/utils/labels';
import { readOrientation } from '@/features/rounds/utils/orientation';

/**
 * Joints from pasted or imported CSV (read with papaparse, utils/csv.ts). Every row is validated and becomes
 * a joint: a row with a problem is kept, with the reasons in `importNote` (and listed by line in `problems`),
 * for the geologist to fix in the table. Nothing is dropped silently: rows of other rounds are left out only
 * when the person picks one round of a file that holds several, and the count says so.
 *
 * The orientation comes from an orientation column (typed text read in the row's notation), or from
 * separate dip direction and dip columns (the most common sheet layout), or from strike (right-hand rule)
 * and dip columns. Roundbook's own joints export is read column for column, so export → import gives the
 * same joints.
 */

type Column =
  | 'kind'
  | 'orientation'
  | 'dipDirection'
  | 'dip'
  | 'strike'
  | 'notation'
  | 'set'
  | 'setOverride'
  | 'spacing'
  | 'persistence'
  | 'aperture'
  | 'jr'
  | 'jrc'
  | 'jrcMethod'
  | 'infill'
  | 'ja'
  | 'water'
  | 'thickness'
  | 'notes'
  | 'sameAs'
  // Columns of our export that say which round a row belongs to, or that Roundbook works out again itself.
  | 'stage'
  | 'roundNumber'
  | 'roundId'
  | 'faceChainage'
  | 'jointNumber'
  | 'jointId'
  | 'readProblem'
  | 'positionRight'
  | 'positionUp';

/** Header words Roundbook understands (lower case; spaces, units in brackets and punctuation ignored). */
const HEADER_WORDS: Record<string, Column> = {
  kind: 'kind',
  type: 'kind',
  orientation: 'orientation',
  plane: 'orientation',
  reading: 'orientation',
  asentered: 'orientation',
  dipdirection: 'dipDirection',
  dipdir: 'dipDirection',
  dd: 'dipDirection',
  dipazimuth: 'dipDirection',
  dip: 'dip',
  dipangle: 'dip',
  strike: 'strike',
  strikerhr: 'strike',
  notation: 'notation',
  set: 'set',
  setchosenbythegeologist: 'setOverride',
  spacing: 'spacing',
  persistence: 'persistence',
  aperture: 'aperture',
  jr: 'jr',
  jrc: 'jrc',
  jrcmethod: 'jrcMethod',
  method: 'jrcMethod',
  infill: 'infill',
  filling: 'infill',
  ja: 'ja',
  water: 'water',
  thickness: 'thickness',
  notes: 'notes',
  note: 'notes',
  remarks: 'notes',
  samefeatureasjointid: 'sameAs',
  stage: 'stage',
  roundnumber: 'roundNumber',
  roundid: 'roundId',
  facechainage: 'faceChainage',
  jointnumber: 'jointNumber',
  jointid: 'jointId',
  notreadablebecause: 'readProblem',
  positionrightoftheaxis: 'positionRight',
  positionabovetheaxis: 'positionUp',
};

/** Columns read but not put on the joint, and why (shown in the dialog, so nothing goes unnoticed). */
const NOT_IMPORTED: Partial<Record<Column, string>> = {
  faceChainage: 'the joint takes the chainage of the round it is added to',
  jointNumber: 'joints are added in the order of the rows',
  jointId: 'added joints get new ids',
  readProblem: 'the orientation is read again',
  positionRight: 'the position on the face comes from the sketch',
  positionUp: 'the position on the face comes from the sketch',
};

/** Without a header: orientation, kind, spacing, persistence, aperture, Jr, Ja, water, notes. */
const DEFAULT_ORDER: Column[] = [
  'orientation',
  'kind',
  'spacing',
  'persistence',
  'aperture',
  'jr',
  'ja',
  'water',
  'notes',
];

/** An orientation given twice (text and dip direction/dip columns) may differ by rounding only. */
const SAME_PLANE_DEG = 0.5;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const squash = (text: string) =>
  text
    .toLowerCase()
    .replace(/\(.*?\)|\[.*?\]/g, '')
    .replace(/[^a-z]/g, '');

function columnOf(header: string): Column | null {
  return HEADER_WORDS[squash(header)] ?? null;
}

function pick<T extends string>(value: string, labels: Record<T, string>): T | null {
  const v = squash(value);
  if (v === '') return null;
  for (const [key, label] of Object.entries(labels) as [T, string][]) {
    if (squash(key) === v || squash(label) === v) return key;
  }
  return null;
}

/** One round named by the file's stage / round number / round id columns. */
export interface ImportRound {
  key: string;
  label: string;
  rows: number;
}

export interface ImportProblem {
  line: number;
  message: string;
}

export interface JointImport {
  joints: JointRow[];
  /** Rows that came in with a problem (kept, with their reason). */
  withProblems: number;
  /** Every problem, by the line its row starts on. */
  problems: ImportProblem[];
  /** Header names that were not understood (their values are put in the notes). */
  ignoredHeaders: string[];
  /** Columns understood but not put on the joints, with the reason. */
  notImported: Array<{ header: string; reason: string }>;
  usedHeader: boolean;
  /** The rounds the file's rows belong to (empty when it has no round columns). */
  rounds: ImportRound[];
  /** Rows left out because they belong to another round than the one picked. */
  otherRounds: number;
}

export interface ImportOptions {
  /** Keep only the rows of this round (an ImportRound key); all rows when omitted. */
  round?: string;
}

type Cells = Partial<Record<Column, string>>;

export function importJoints(
  text: string,
  defaultNotation: PlaneNotation,
  options: ImportOptions = {},
): JointImport {
  const { rows } = parseCsv(text);
  const empty: JointImport = {
    joints: [],
    withProblems: 0,
    problems: [],
    ignoredHeaders: [],
    notImported: [],
    usedHeader: false,
    rounds: [],
    otherRounds: 0,
  };
  if (rows.length === 0) return empty;
  const headerColumns = rows[0].fields.map(columnOf);
  const usedHeader =
    headerColumns.includes('orientation') ||
    (headerColumns.includes('dip') &&
      (headerColumns.includes('dipDirection') || headerColumns.includes('strike')));
  const columns: (Column | null)[] = usedHeader ? headerColumns : DEFAULT_ORDER;
  const headers = usedHeader ? rows[0].fields : [];
  const ignoredHeaders = headers.filter((h, i) => headerColumns[i] === null && h !== '');
  const notImported = headers.flatMap((h, i) => {
    const reason = NOT_IMPORTED[headerColumns[i] ?? 'kind'];
    return reason === undefined ? [] : [{ header: h, reason }];
  });
  const dataRows = (usedHeader ? rows.slice(1) : rows).map((row) => ({
    row,
    cells: cellsOf(row, columns),
  }));

  const rounds = new Map<string, ImportRound>();
  const roundKey = (cells: Cells): string | null => {
    if (cells.roundId) return cells.roundId;
    if (cells.stage || cells.roundNumber) return `${cells.stage ?? ''} ${cells.roundNumber ?? ''}`.trim();
    return null;
  };
  for (const { cells } of dataRows) {
    const key = roundKey(cells);
    if (key === null) continue;
    const known = rounds.get(key);
    if (known) known.rows += 1;
    else {
      const name = [cells.stage, cells.roundNumber && `round ${cells.roundNumber}`]
        .filter((p) => p)
        .join(', ');
      const at = cells.faceChainage ? ` at ${cells.faceChainage} m` : '';
      rounds.set(key, { key, label: `${name || key}${at}`, rows: 1 });
    }
  }
  const chosen =
    options.round === undefined ? dataRows : dataRows.filter((r) => roundKey(r.cells) === options.round);
  const joints = chosen.map(({ row, cells }) => jointOf(row, cells, columns, headers, defaultNotation));
  const problems = joints.flatMap((j, i) =>
    j.importNote === '' ? [] : [{ line: chosen[i].row.line, message: j.importNote }],
  );
  return {
    joints,
    withProblems: problems.length,
    problems,
    ignoredHeaders,
    notImported,
    usedHeader,
    rounds: [...rounds.values()],
    otherRounds: dataRows.length - chosen.length,
  };
}

/**
 * Our export writes text a spreadsheet would run as a formula with a leading apostrophe (papaparse
 * escapeFormulae: text starting with =, +, -, @, tab or carriage return); reading it back removes it.
 */
const unescapeFormula = (value: string) => (/^'[=+\-@\t\r]/.test(value) ? value.slice(1) : value);

function cellsOf(row: CsvRow, columns: (Column | null)[]): Cells {
  const cells: Cells = {};
  row.fields.map(unescapeFormula).forEach((value, i) => {
    const column = columns[i] ?? null;
    if (column !== null && value !== '' && cells[column] === undefined) cells[column] = value;
  });
  return cells;
}

/** A number typed with a decimal comma or point, as text for a plane ("50,5" → "50.5"). */
const decimalText = (value: string) => value.trim().replace(',', '.');

function jointOf(
  row: CsvRow,
  cells: Cells,
  columns: (Column | null)[],
  headers: string[],
  defaultNotation: PlaneNotation,
): JointRow {
  const joint = emptyJoint(defaultNotation);
  const problems: string[] = [];
  const extraNotes: string[] = [];
  if (row.problem !== undefined) problems.push(row.problem.replace(/\.$/, ''));
  if (row.fields.length > columns.length) {
    problems.push(
      `has ${row.fields.length} values but ${columns.length} columns; the extra values are in the notes`,
    );
  }
  row.fields.forEach((value, i) => {
    if ((columns[i] ?? null) === null && value !== '')
      extraNotes.push(headers[i] ? `${headers[i]}: ${value}` : value);
  });
  const number = (value: string | undefined, label: string, set: (v: string) => void) => {
    if (value === undefined) return;
    const n = numberOf(value);
    if (n === null || Number.isNaN(n)) problems.push(`${label} "${value}" is not a number`);
    set(value);
  };

  if (cells.kind !== undefined) {
    const kind = pick<JointKind>(cells.kind, jointKindLabels);
    if (kind === null) {
      problems.push(
        `kind "${cells.kind}" is not one of ${Object.values(jointKindLabels).join(', ')}; taken as a joint`,
      );
    } else joint.kind = kind;
  }
  if (cells.notation !== undefined) {
    const notation = pick<PlaneNotation>(cells.notation, notationLabels);
    if (notation === null)
      problems.push(`notation "${cells.notation}" is not known; the project's default is used`);
    else joint.notation = notation;
  }
  orientationOf(cells, joint, problems);
  if (cells.set !== undefined) {
    joint.setLabel = cells.set;
    // A set column alone is the geologist's own label; our export says whether it was.
    const override = cells.setOverride === undefined ? 'yes' : squash(cells.setOverride);
    if (override !== 'yes' && override !== 'no')
      problems.push(`"set chosen by the geologist" is "${cells.setOverride}"; write yes or no`);
    joint.setOverride = override !== 'no';
  }
  number(cells.spacing, 'spacing', (v) => (joint.spacingM = v));
  number(cells.persistence, 'persistence', (v) => (joint.persistenceM = v));
  number(cells.aperture, 'aperture', (v) => (joint.apertureMm = v));
  number(cells.jr, 'Jr', (v) => (joint.jr = v));
  number(cells.jrc, 'JRC', (v) => (joint.jrc = v));
  number(cells.ja, 'Ja', (v) => (joint.ja = v));
  number(cells.thickness, 'thickness', (v) => (joint.thicknessM = v));
  if (cells.jrcMethod !== undefined) {
    const method = pick<JrcMethod>(cells.jrcMethod, jrcMethodLabels);
    if (method === null) problems.push(`JRC method "${cells.jrcMethod}" is not known`);
    else joint.jrcMethod = method;
  }
  if (cells.infill !== undefined) joint.infill = cells.infill;
  if (cells.water !== undefined) {
    const water = pick<JointWater>(cells.water, waterLabels);
    if (water === null)
      problems.push(`water "${cells.water}" is not one of ${Object.values(waterLabels).join(', ')}`);
    else joint.water = water;
  }
  if (cells.notes !== undefined) joint.notes = cells.notes;
  if (cells.sameAs !== undefined) {
    if (UUID.test(cells.sameAs)) joint.sameAsJointId = cells.sameAs.toLowerCase();
    else problems.push(`"same feature as joint id" "${cells.sameAs}" is not a joint id`);
  }
  if (extraNotes.length > 0) joint.notes = [joint.notes, ...extraNotes].filter((n) => n !== '').join('; ');
  joint.importNote = problems.length === 0 ? '' : `Line ${row.line}: ${problems.join('; ')}.`;
  return joint;
}

/**
 * The joint's orientation text and notation from the row, and the problems with it. Typed text wins (it is
 * what the geologist wrote, and our export's "as entered"); dip direction / dip (or strike / dip) columns
 * fill it when it is empty, and are checked against it when both are given.
 */
function orientationOf(cells: Cells, joint: JointRow, problems: string[]): void {
  const { orientation, dipDirection, dip, strike } = cells;
  // With both dip direction and strike columns, the dip direction is used (the strike is redundant).
  const direction = dipDirection ?? strike;
  const directionName = dipDirection !== undefined ? 'dip direction' : 'strike';
  let columnsPlane: string | null = null;
  if (direction !== undefined && dip !== undefined) {
    columnsPlane = `${decimalText(direction)}/${decimalText(dip)}`;
  } else if (orientation === undefined) {
    if (direction !== undefined) problems.push(`${directionName} "${direction}" is given without a dip`);
    else if (dip !== undefined) problems.push(`dip "${dip}" is given without a dip direction or strike`);
  }
  const columnsNotation: PlaneNotation = dipDirection !== undefined ? 'dip-direction/dip' : 'strike/dip-rhr';

  if (orientation === undefined) {
    if (columnsPlane === null) {
      if (direction === undefined && dip === undefined) problems.push('no orientation');
      return;
    }
    joint.orientationText = columnsPlane;
    joint.notation = columnsNotation;
  } else {
    joint.orientationText = orientation;
  }
  const reading = readOrientation(joint.orientationText, joint.notation);
  if (reading.kind === 'error') {
    problems.push(reading.message);
    return;
  }
  if (reading.kind !== 'plane' || orientation === undefined || columnsPlane === null) return;
  try {
    const given = parsePlane(columnsPlane, { notation: columnsNotation });
    const angle = angleBetweenPlanes(given, reading.plane);
    if (angle > SAME_PLANE_DEG)
      problems.push(
        `the orientation "${orientation}" reads as ${reading.dipDirectionDip} but the ${directionName} and dip columns say ${columnsPlane} (${angle.toFixed(1)}° apart)`,
      );
  } catch (error) {
    problems.push(
      `the ${directionName} and dip columns (${columnsPlane}) cannot be read: ${
        error instanceof OrientationError ? error.message : 'not an orientation'
      }`,
    );
  }
}
