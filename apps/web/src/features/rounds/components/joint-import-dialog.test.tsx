import { fireEvent, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { JointImportDialog } from '@/features/rounds/components/joint-import-dialog';
import type { JointRow } from '@/features/rounds/schemas/round-form';
import { renderWithProviders } from '@/features/rounds/testing/round-fixtures';
import { findDialog } from '@/testing/dialogs';

const sheet = [
  'stage,round number,face chainage (m),dip direction (°),dip (°),kind',
  'full-face,11,1010.5,130,50,joint',
  'full-face,12,1013.5,140,,joint',
  'full-face,12,1013.5,220,30,fault',
].join('\n');

describe('JointImportDialog', () => {
  it('lists the problems by line, lets one round of several be picked and adds what it says', async () => {
    const onImport = jest.fn<void, [JointRow[]]>();
    const user = userEvent.setup();
    renderWithProviders(
      <JointImportDialog open defaultNotation="dip-direction/dip" onClose={() => {}} onImport={onImport} />,
    );
    const dialog = await findDialog('Paste or import joints', 'dialog');
    // A paste, as one change (typing would read every keystroke).
    fireEvent.change(within(dialog).getByRole('textbox', { hidden: true }), { target: { value: sheet } });
    expect(within(dialog).getByTestId('import-preview')).toHaveTextContent(
      '3 joints read, 1 with problems: they are added too, marked with the reason, for you to fix.',
    );
    expect(within(dialog).getByTestId('import-preview')).toHaveTextContent(
      'Not taken over: face chainage (m) (the joint takes the chainage of the round it is added to).',
    );
    expect(
      within(within(dialog).getByTestId('import-problems'))
        .getAllByRole('listitem', { hidden: true })
        .map((li) => li.textContent),
    ).toEqual(['Line 3: dip direction "140" is given without a dip.']);

    await user.selectOptions(within(dialog).getByRole('combobox', { hidden: true }), 'full-face 11');
    expect(within(dialog).getByTestId('import-preview')).toHaveTextContent(
      '1 joint read, all readable. 2 rows of other rounds left out, as chosen.',
    );
    expect(within(dialog).queryByTestId('import-problems')).toBeNull();
    await user.click(within(dialog).getByRole('button', { name: 'Add 1 joint', hidden: true }));
    expect(onImport).toHaveBeenCalledTimes(1);
    expect(onImport.mock.calls[0][0].map((j) => [j.orientationText, j.notation, j.kind])).toEqual([
      ['130/50', 'dip-direction/dip', 'joint'],
    ]);
    expect(screen.queryByTestId('import-preview')).toBeNull();
  });
});
