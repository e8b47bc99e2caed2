import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parsePlane } from '@roundbook/geomath';
import { jointInputOf } from '@/features/rounds/schemas/round-form';
import { importJoints } from '@/features/rounds/utils/joint-import';

/**
 * The CSV round trip (issue 16): fixtures/joints-round-trip/joints.json was saved through the API and its
 * export is joints-export.csv (apps/api/test/exports.e2e-spec.ts checks the export against that file, ids
 * blanked); here the import reads the export back.
 */
const ROUND_TRIP = join(__dirname, '../../../../../../fixtures/joints-round-trip');

const messageOf = (
  text: string,
  notation: 'dip-direction/dip' | 'dip/dip-direction' = 'dip-direction/dip',
) => {
  try {
    parsePlane(text, { notation });
    return '';
  } catch (e) {
    return (e as Error).message;
  }
};

describe('importJoints', () => {
  it('maps a header in any order and case, with units in brackets', () => {
    const result = importJoints(
      'Kind;Orientation;Spacing (m);Persistence [m];JR;Ja;Water;Notes\nBedding;N30E 40SE;0,4;3;1.5;2;damp;along the contact',
      'dip-direction/dip',
    );
    expect(result.usedHeader).toBe(true);
    expect(result.withProblems).toBe(0);
    expect(result.joints[0]).toMatchObject({
      kind: 'bedding',
      orientationText: 'N30E 40SE',
      spacingM: '0,4',
      persistenceM: '3',
      jr: '1.5',
      ja: '2',
      water: 'damp',
      notes: 'along the contact',
      importNote: '',
    });
  });

  it('keeps every bad row, with the reason and the line it came from', () => {
    const text = [
      'orientation,kind,spacing,water,notation',
      '130/50,joint,0.4,dry,',
      '130/95,joint,0.3,,', // dip out of range
      'N30E 40NE,fault,,,', // contradictory quadrant
      '50/130,joint,,,', // looks swapped in dip direction/dip
      ',joint,0.2,,', // no orientation
      '045/60,dyke,abc,soaking,sideways', // unknown kind, number, water and notation
      '030/40,joint,1,dry,,extra value',
    ].join('\n');
    const result = importJoints(text, 'dip-direction/dip');
    expect(result.joints).toHaveLength(7);
    expect(result.withProblems).toBe(6);
    const notes = result.joints.map((j) => j.importNote);
    expect(notes[0]).toBe('');
    expect(notes[1]).toBe(`Line 3: ${messageOf('130/95')}.`);
    expect(notes[2]).toContain(messageOf('N30E 40NE'));
    expect(notes[3]).toContain('It looks like dip/dip direction');
    expect(notes[4]).toBe('Line 6: no orientation.');
    expect(notes[5]).toContain('kind "dyke" is not one of');
    expect(notes[5]).toContain('spacing "abc" is not a number');
    expect(notes[5]).toContain('water "soaking" is not one of');
    expect(notes[5]).toContain('notation "sideways" is not known');
    expect(notes[6]).toContain('has 6 values but 5 columns');
    // Nothing typed is lost: the values stay in the row for fixing.
    expect(result.joints[5]).toMatchObject({ orientationText: '045/60', spacingM: 'abc', kind: 'joint' });
    expect(result.joints[6].notes).toBe('extra value');
  });

  it('reads rows without a header in the documented order', () => {
    const result = importJoints('130/50\tfault\t0.5\n310/70\tjoint', 'dip-direction/dip');
    expect(result.usedHeader).toBe(false);
    expect(result.joints.map((j) => [j.orientationText, j.kind, j.spacingM])).toEqual([
      ['130/50', 'fault', '0.5'],
      ['310/70', 'joint', ''],
    ]);
  });

  it('reads a notation column and a set column (kept as the geologist’s own label)', () => {
    const result = importJoints('orientation,notation,set\n50/130,dip/dip-direction,J1', 'dip-direction/dip');
    expect(result.joints[0]).toMatchObject({
      notation: 'dip/dip-direction',
      setLabel: 'J1',
      setOverride: true,
    });
    expect(result.joints[0].importNote).toBe('');
  });

  it('puts columns it does not know into the notes and says which', () => {
    const result = importJoints('orientation,colour\n130/50,rusty', 'dip-direction/dip');
    expect(result.ignoredHeaders).toEqual(['colour']);
    expect(result.joints[0].notes).toBe('colour: rusty');
  });

  it('reads our own joints export back into the same joints (export → import round trip)', () => {
    const saved = (JSON.parse(readFileSync(join(ROUND_TRIP, 'joints.json'), 'utf8')) as { joints: object[] })
      .joints;
    const csv = readFileSync(join(ROUND_TRIP, 'joints-export.csv'), 'utf8');
    expect(csv.startsWith('\ufeff')).toBe(true);
    const result = importJoints(csv, 'strike/dip-rhr');
    expect(result.usedHeader).toBe(true);
    expect(result.ignoredHeaders).toEqual([]);
    // New joints get new ids (the export's are not reused), and a UUID key is sent as the joint's id.
    expect(result.joints.map((j) => ({ ...jointInputOf(j), id: undefined }))).toEqual(
      saved.map((j) => ({ ...j, id: undefined })),
    );
    expect(new Set(result.joints.map((j) => j.key)).size).toBe(saved.length);
    // The one unreadable orientation (dip 95) comes back as typed, flagged on its line (the fault's notes
    // take two lines, 4 and 5).
    expect(result.problems).toEqual([{ line: 7, message: `Line 7: ${messageOf('130/95')}.` }]);
    expect(result.rounds).toEqual([
      { key: expect.any(String), label: 'full-face, round 1 at 1003 m', rows: 5 },
    ]);
    expect(result.notImported.map((c) => c.header)).toEqual([
      'face chainage (m)',
      'joint number',
      'not readable because',
      'position right of the axis (m)',
      'position above the axis (m)',
      'joint id',
    ]);
  });

  it('reads separate dip direction and dip columns (the most common sheet layout), decimal commas too', () => {
    const result = importJoints(
      'Dip direction (°);Dip (°);Kind;Spacing (m)\n130;50;joint;0,4\n045;60,5;fault;\n310;;joint;1\n;35;joint;',
      'strike/dip-rhr',
    );
    expect(result.usedHeader).toBe(true);
    expect(result.joints).toHaveLength(4);
    expect(
      result.joints.slice(0, 2).map((j) => [j.orientationText, j.notation, j.kind, j.importNote]),
    ).toEqual([
      ['130/50', 'dip-direction/dip', 'joint', ''],
      ['045/60.5', 'dip-direction/dip', 'fault', ''],
    ]);
    expect(parsePlane(result.joints[1].orientationText, { notation: 'dip-direction/dip' })).toEqual({
      dipDirection: 45,
      dip: 60.5,
    });
    // A dip direction without its dip, and a dip without its direction: kept, and said so on their lines.
    expect(result.problems).toEqual([
      { line: 4, message: 'Line 4: dip direction "310" is given without a dip.' },
      { line: 5, message: 'Line 5: dip "35" is given without a dip direction or strike.' },
    ]);
    expect(result.joints[2].spacingM).toBe('1');
  });

  it('reads strike and dip columns by the right-hand rule', () => {
    const [joint] = importJoints('strike,dip\n040,30', 'dip-direction/dip').joints;
    expect(joint).toMatchObject({ orientationText: '040/30', notation: 'strike/dip-rhr', importNote: '' });
    // Right-hand rule: the dip direction is the strike + 90° [common practice].
    expect(parsePlane(joint.orientationText, { notation: joint.notation })).toEqual({
      dipDirection: 130,
      dip: 30,
    });
  });

  it('checks typed text against dip direction and dip columns given beside it', () => {
    const result = importJoints(
      'orientation,dip direction,dip\nN30E 40SE,120,40\n130/50,130.2,50.1\n130/50,310,50',
      'dip-direction/dip',
    );
    expect(result.joints.map((j) => j.orientationText)).toEqual(['N30E 40SE', '130/50', '130/50']);
    expect(result.joints[0].importNote).toBe('');
    expect(result.joints[1].importNote).toBe(''); // within rounding (0.5°)
    expect(result.joints[2].importNote).toBe(
      'Line 4: the orientation "130/50" reads as 130/50 but the dip direction and dip columns say 310/50 (80.0° apart).',
    );
  });

  it('keeps the rows of one round when the file holds several, and counts the others', () => {
    const text = [
      'stage,round number,face chainage (m),dip direction (°),dip (°)',
      'full-face,11,1010.5,130,50',
      'full-face,12,1013.5,140,55',
      'full-face,12,1013.5,220,30',
    ].join('\r\n');
    const all = importJoints(text, 'dip-direction/dip');
    expect(all.rounds).toEqual([
      { key: 'full-face 11', label: 'full-face, round 11 at 1010.5 m', rows: 1 },
      { key: 'full-face 12', label: 'full-face, round 12 at 1013.5 m', rows: 2 },
    ]);
    expect(all.joints).toHaveLength(3);
    const one = importJoints(text, 'dip-direction/dip', { round: 'full-face 12' });
    expect(one.joints.map((j) => j.orientationText)).toEqual(['140/55', '220/30']);
    expect(one.otherRounds).toBe(1);
  });

  it('lists a row papaparse cannot read cleanly, and keeps its text', () => {
    const result = importJoints('orientation,notes\n130/50,"open quote\n045/80,fault', 'dip-direction/dip');
    expect(result.joints).toHaveLength(1);
    expect(result.problems[0].line).toBe(2);
    expect(result.problems[0].message).toContain('A quote opened on line 2 is never closed');
    expect(result.joints[0].orientationText).toBe('130/50');
    expect(result.joints[0].notes).toBe('open quote\n045/80,fault');
  });
});
