import { FluentProvider } from '@fluentui/react-components';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { roundbookLightTheme } from '../theme/theme';
import { FormFooter } from './form-footer';

const wrap = (ui: React.ReactElement) =>
  render(<FluentProvider theme={roundbookLightTheme}>{ui}</FluentProvider>);

describe('FormFooter', () => {
  it('shows why the last save failed as an alert, above the save and cancel buttons', async () => {
    const onCancel = jest.fn();
    wrap(
      <FormFooter
        problem="The server did not answer."
        submitting={false}
        submitLabel="Save heading"
        onCancel={onCancel}
      />,
    );
    expect(screen.getByRole('alert')).toHaveTextContent('Not savedThe server did not answer.');
    expect(screen.getByRole('button', { name: 'Save heading' })).toHaveAttribute('type', 'submit');
    await userEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(onCancel).toHaveBeenCalledTimes(1);
  });

  it('disables both buttons while saving, and has no alert and no Cancel when not asked for', () => {
    wrap(
      <FormFooter
        problem={null}
        submitting
        submitLabel="Add class"
        extra={<button type="button">Try</button>}
      />,
    );
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Cancel' })).not.toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Add class' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Try' })).toBeEnabled();
  });
});
