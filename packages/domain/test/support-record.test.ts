import {
  plannedSupport,
  supportItemErrors,
  formatSupportQuantity,
  outstandingSupportLine,
} from '../src/support-record.js';

const c3 = {
  code: 'C3',
  boltType: 'Fully grouted rebar bolt',
  boltLength: 3,
  boltPattern: '1.5 m × 1.5 m',
  shotcreteMm: 75,
  steelSupport: '',
  probingRequired: true,
};

describe('plannedSupport (what the class names, element by element)', () => {
  it('reads bolts, sprayed concrete and probing from the class; spiles and mesh are never planned', () => {
    const plan = Object.fromEntries(plannedSupport(c3).map((p) => [p.element, p]));
    expect(plan.bolts).toEqual({
      element: 'bolts',
      inClass: true,
      quantity: null,
      length: 3,
      text: 'Fully grouted rebar bolt, 1.5 m × 1.5 m',
    });
    expect(plan['sprayed-concrete']).toMatchObject({ inClass: true, quantity: 75, text: '75 mm' });
    expect(plan['probe-holes'].inClass).toBe(true);
    expect(plan['steel-sets'].inClass).toBe(false);
    expect(plan.spiles.inClass).toBe(false);
    expect(plan.mesh.inClass).toBe(false);
  });

  it('plans nothing for a class without support elements', () => {
    const bare = {
      ...c3,
      boltType: '',
      boltLength: null,
      boltPattern: '',
      shotcreteMm: 0,
      probingRequired: false,
    };
    expect(plannedSupport(bare).filter((p) => p.inClass)).toEqual([]);
  });
});

describe('supportItemErrors (one checklist item)', () => {
  const item = { element: 'bolts' as const, status: 'done' as const, quantity: 12, length: 3, reason: '' };

  it('accepts a complete done item', () => {
    expect(supportItemErrors(item)).toEqual({});
  });

  it('refuses fractions of a count, negative and oversized quantities', () => {
    expect(supportItemErrors({ ...item, quantity: 2.5 }).quantity).toMatch(/whole pieces/);
    expect(supportItemErrors({ ...item, quantity: -1 }).quantity).toMatch(/0 or more/);
    expect(supportItemErrors({ ...item, quantity: 501 }).quantity).toMatch(/at most 500/);
  });

  it('asks for the quantity and length before done, and a reason for not needed', () => {
    expect(supportItemErrors({ ...item, quantity: null }).quantity).toMatch(/how much was installed/);
    expect(supportItemErrors({ ...item, length: null }).length).toMatch(/installed length/);
    expect(supportItemErrors({ ...item, status: 'not-needed', quantity: null, length: null }).reason).toMatch(
      /why it is not needed/,
    );
  });

  it('refuses a length on an element that has none, and allows a partial outstanding item', () => {
    expect(
      supportItemErrors({ element: 'mesh', status: 'outstanding', quantity: 10, length: 2, reason: '' })
        .length,
    ).toMatch(/no length/);
    expect(
      supportItemErrors({
        element: 'sprayed-concrete',
        status: 'outstanding',
        quantity: 40,
        length: null,
        reason: '',
      }),
    ).toEqual({});
  });

  it('formats quantities with their unit', () => {
    expect(formatSupportQuantity('bolts', 12, 3)).toBe('12 no. × 3 m');
    expect(formatSupportQuantity('sprayed-concrete', 50, null)).toBe('50 mm');
    expect(formatSupportQuantity('mesh', null, null)).toBe('—');
  });
});

describe('outstandingSupportLine (the handover lists each outstanding item in one line)', () => {
  it('says the round, the stage, the class, the plan and what was installed', () => {
    expect(
      outstandingSupportLine({
        roundNumber: 12,
        stageLabel: 'top heading',
        classCode: 'C3',
        element: 'bolts',
        planned: { quantity: null, length: 4, text: 'Invented grouted bar, 1.5 m × 1.5 m' },
        quantity: 8,
        length: 4,
        reason: 'four left for the next shift',
      }),
    ).toBe(
      'Round 12 (top heading, class C3): Rock bolts — planned Invented grouted bar, 1.5 m × 1.5 m, 4 m long; 8 no. × 4 m installed (four left for the next shift)',
    );
  });

  it('says nothing recorded when no quantity was entered, and leaves out an empty plan', () => {
    expect(
      outstandingSupportLine({
        roundNumber: 3,
        stageLabel: 'full face',
        classCode: null,
        element: 'mesh',
        planned: { quantity: null, length: null, text: '' },
        quantity: null,
        length: null,
        reason: '',
      }),
    ).toBe('Round 3 (full face): Mesh — nothing recorded');
  });
});
