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
 * Joints from pasted or imported CSV. Every row becomes a joint: a row with a problem is kept, with the
 * reasons in `importNote`, for the geologist to fix in the table. Nothing is dropped silently.
 */

type Column =
  | 'kind'
  | 'orientation'
  | 'notation'
  | 'set'
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
  | 'notes';

/** Header words Roundbook understands (lower case, spaces, units and punctuation ignored). */
const HEADER_WORDS: Record<string, Column> = {
  kind: 'kind',
  type: 'kind',
  orientation: 'orientation',
  plane: 'orientation',
  reading: 'orientation',
  notation: 'notation',
  set: 'set',
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

export interface JointImport {
  joints: JointRow[];
  /** Rows that came in with a problem (kept, with their reason). */
  withProblems: number;
  /** Header names that were not understood (their values are put in the notes). */
  ignoredHeaders: string[];
  usedHeader: boolean;
}

export function importJoints(text: string, defaultNotation: PlaneNotation): JointImport {
  const { rows } = parseCsv(text);
  if (rows.length === 0) return { joints: [], withProblems: 0, ignoredHeaders: [], usedHeader: false };
  const headerColumns = rows[0].fields.map(columnOf);
  const usedHeader = headerColumns.includes('orientation');
  const columns: (Column | null)[] = usedHeader ? headerColumns : DEFAULT_ORDER;
  const ignoredHeaders = usedHeader
    ? rows[0].fields.filter((_, i) => headerColumns[i] === null && rows[0].fields[i] !== '')
    : [];
  const dataRows = usedHeader ? rows.slice(1) : rows;
  const joints = dataRows.map((row) =>
    jointOf(row, columns, usedHeader ? rows[0].fields : [], defaultNotation),
  );
  return {
    joints,
    withProblems: joints.filter((j) => j.importNote !== '').length,
    ignoredHeaders,
    usedHeader,
  };
}

function jointOf(
  row: CsvRow,
  columns: (Column | null)[],
  headers: string[],
  defaultNotation: PlaneNotation,
): JointRow {
  const joint = emptyJoint(defaultNotation);
  const problems: string[] = [];
  const extraNotes: string[] = [];
  if (row.problem !== undefined) problems.push(row.problem);
  if (row.fields.length > columns.length) {
    problems.push(
      `has ${row.fields.length} values but ${columns.length} columns; the extra values are in the notes`,
    );
  }
  row.fields.forEach((raw, i) => {
    const value = raw.trim();
    const column = columns[i] ?? null;
    if (column === null) {
      if (value !== '') extraNotes.push(headers[i] ? `${headers[i]}: ${value}` : value);
      return;
    }
    const number = (label: string, set: (v: string) => void) => {
      if (value === '') return;
      const n = numberOf(value);
      if (n === null || Number.isNaN(n)) problems.push(`${label} "${value}" is not a number`);
      set(value);
    };
    switch (column) {
      case 'kind': {
        if (value === '') break;
        const kind = pick<JointKind>(value, jointKindLabels);
        if (kind === null) {
          problems.push(
            `kind "${value}" is not one of ${Object.values(jointKindLabels).join(', ')}; taken as a joint`,
          );
        } else joint.kind = kind;
        break;
      }
      case 'orientation':
        joint.orientationText = value;
        break;
      case 'notation': {
        if (value === '') break;
        const notation = pick<PlaneNotation>(value, notationLabels);
        if (notation === null)
          problems.push(`notation "${value}" is not known; the project's default is used`);
        else joint.notation = notation;
        break;
      }
      case 'set':
        if (value !== '') {
          joint.setLabel = value;
          joint.setOverride = true;
        }
        break;
      case 'spacing':
        number('spacing', (v) => (joint.spacingM = v));
        break;
      case 'persistence':
        number('persistence', (v) => (joint.persistenceM = v));
        break;
      case 'aperture':
        number('aperture', (v) => (joint.apertureMm = v));
        break;
      case 'jr':
        number('Jr', (v) => (joint.jr = v));
        break;
      case 'jrc':
        number('JRC', (v) => (joint.jrc = v));
        break;
      case 'jrcMethod': {
        if (value === '') break;
        const method = pick<JrcMethod>(value, jrcMethodLabels);
        if (method === null) problems.push(`JRC method "${value}" is not known`);
        else joint.jrcMethod = method;
        break;
      }
      case 'infill':
        joint.infill = value;
        break;
      case 'ja':
        number('Ja', (v) => (joint.ja = v));
        break;
      case 'water': {
        if (value === '') break;
        const water = pick<JointWater>(value, waterLabels);
        if (water === null)
          problems.push(`water "${value}" is not one of ${Object.values(waterLabels).join(', ')}`);
        else joint.water = water;
        break;
      }
      case 'thickness':
        number('thickness', (v) => (joint.thicknessM = v));
        break;
      case 'notes':
        joint.notes = value;
        break;
    }
  });
  if (extraNotes.length > 0) joint.notes = [joint.notes, ...extraNotes].filter((n) => n !== '').join('; ');
  const reading = readOrientation(joint.orientationText, joint.notation);
  if (reading.kind === 'empty') problems.push('no orientation');
  else if (reading.kind === 'error') problems.push(reading.message);
  joint.importNote = problems.length === 0 ? '' : `Line ${row.line}: ${problems.join('; ')}.`;
  return joint;
}
