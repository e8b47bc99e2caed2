import { ROUND_STATUSES } from '@roundbook/domain';
import { DomainException } from '../../common/errors/domain.exception.js';
import {
  ROUND_EVENTS,
  ROUND_TRANSITIONS,
  applyTransition,
  assertEditable,
  canTransition,
} from './round-status.js';

describe('round status transitions (the one table)', () => {
  const allowed: Record<string, string> = {
    'draft:submit': 'submitted',
    'returned:submit': 'submitted',
    'submitted:confirm': 'confirmed',
    'submitted:return': 'returned',
    'confirmed:correct': 'draft',
  };

  it.each(ROUND_STATUSES.flatMap((s) => ROUND_EVENTS.map((e) => [s, e] as const)))(
    'from %s on %s: allowed only where the table says',
    (status, event) => {
      const round = { status, revision: 1 };
      const expected = allowed[`${status}:${event}`];
      expect(canTransition(status, event)).toBe(expected !== undefined);
      if (expected === undefined) {
        expect(() => applyTransition(round, event)).toThrow(DomainException);
        expect(round).toEqual({ status, revision: 1 });
      } else {
        expect(applyTransition(round, event).to).toBe(expected);
        expect(round.status).toBe(expected);
        expect(round.revision).toBe(ROUND_TRANSITIONS[event].newRevision ? 2 : 1);
      }
    },
  );

  it('lets only drafts and returned rounds be edited', () => {
    expect(() => assertEditable('draft')).not.toThrow();
    expect(() => assertEditable('returned')).not.toThrow();
    expect(() => assertEditable('submitted')).toThrow(
      'This round is submitted; it can no longer be edited here.',
    );
    expect(() => assertEditable('confirmed')).toThrow(DomainException);
  });
});
