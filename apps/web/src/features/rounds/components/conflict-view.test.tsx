import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { RoundConflictView } from '@/features/rounds/components/conflict-view';
import { emptyJoint, formValuesOf } from '@/features/rounds/schemas/round-form';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { draftRound, renderWithProviders } from '@/features/rounds/testing/round-fixtures';

const joint = { ...emptyJoint('dip-direction/dip'), key: 'j-a', orientationText: '130/50' };
const base: RoundFormValues = { ...formValuesOf(draftRound), groundNotes: 'Blocky', joints: [joint] };

function render(mine: RoundFormValues, theirs: RoundFormValues) {
  const onApply = jest.fn();
  const onTakeTheirs = jest.fn();
  renderWithProviders(
    <RoundConflictView
      message="Someone saved this round first."
      changedBy="Ailsa Drummond"
      base={base}
      mine={mine}
      theirs={theirs}
      onApply={onApply}
      onTakeTheirs={onTakeTheirs}
    />,
  );
  return { onApply, onTakeTheirs };
}

describe('RoundConflictView', () => {
  it('says who saved, merges a joint field by field and keeps my joint notes on the main button', async () => {
    const mine = { ...base, joints: [{ ...joint, notes: 'Slickensided, calcite 2 mm' }] };
    const theirs = { ...base, joints: [{ ...joint, orientationText: '132/48' }] };
    const { onApply, onTakeTheirs } = render(mine, theirs);
    const view = screen.getByTestId('conflict-view');
    expect(view).toHaveTextContent('Ailsa Drummond saved this round while you were typing');
    expect(within(view).getByTestId('merged-theirs')).toHaveTextContent('Joint 1, orientation');
    expect(within(view).getByTestId('merged-mine')).toHaveTextContent('Joint 1, notes');
    expect(within(view).queryAllByTestId('conflict-field')).toHaveLength(0);
    await userEvent.click(screen.getByRole('button', { name: 'Save the merge' }));
    expect(onTakeTheirs).not.toHaveBeenCalled();
    const merged = onApply.mock.calls[0][0] as RoundFormValues;
    expect(merged.joints[0]).toMatchObject({
      orientationText: '132/48',
      notes: 'Slickensided, calcite 2 mm',
    });
  });

  it('shows both values where both changed the same field and applies the choice per field', async () => {
    const mine = { ...base, groundNotes: 'Wet in the crown', distantParts: 'Invert under muck' };
    const theirs = { ...base, groundNotes: 'Dry', distantParts: 'Whole face seen' };
    const { onApply } = render(mine, theirs);
    const fields = screen.getAllByTestId('conflict-field');
    expect(fields).toHaveLength(2);
    const notes = fields.find((f) => f.textContent?.includes('Notes on the ground'));
    if (notes === undefined) throw new Error('no question for the ground notes');
    expect(within(notes).getByRole('radio', { name: 'Yours: Wet in the crown' })).toBeChecked();
    await userEvent.click(within(notes).getByRole('radio', { name: 'Theirs: Dry' }));
    await userEvent.click(screen.getByRole('button', { name: 'Save the merge' }));
    const merged = onApply.mock.calls[0][0] as RoundFormValues;
    expect(merged.groundNotes).toBe('Dry');
    // Not chosen: mine stays.
    expect(merged.distantParts).toBe('Invert under muck');
  });
});
