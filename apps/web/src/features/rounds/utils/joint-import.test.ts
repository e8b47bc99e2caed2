import { parsePlane } from '@roundbook/geomath';
import { importJoints } from '@/features/rounds/utils/joint-import';

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
});
