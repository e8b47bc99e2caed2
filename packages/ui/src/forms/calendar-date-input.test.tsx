import { FluentProvider } from '@fluentui/react-components';
import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { roundbookLightTheme } from '../theme/theme';
import { CalendarDateInput } from './calendar-date-input';

function Harness(props: { initial: string; steppers?: boolean; clearable?: boolean; readOnly?: boolean }) {
  const [value, setValue] = useState(props.initial);
  return (
    <FluentProvider theme={roundbookLightTheme}>
      <CalendarDateInput
        label="Shift date"
        value={value}
        onChange={setValue}
        steppers={props.steppers}
        clearable={props.clearable}
        readOnly={props.readOnly}
      />
      <output data-testid="value">{value}</output>
    </FluentProvider>
  );
}

describe('CalendarDateInput', () => {
  it('shows the date in the one style of every screen, not the browser’s language, and keeps YYYY-MM-DD', () => {
    render(<Harness initial="2026-12-02" />);
    // 2 December 2026 is a Wednesday [ISO 8601 calendar; checked in packages/domain's format test].
    expect(screen.getByTestId('calendar-date-text')).toHaveTextContent('Wed 2 Dec 2026');
    const input = screen.getByLabelText('Shift date');
    expect(input).toHaveAttribute('type', 'date');
    expect(input).toHaveValue('2026-12-02');
    fireEvent.change(input, { target: { value: '2026-11-28' } });
    expect(screen.getByTestId('value')).toHaveTextContent('2026-11-28');
    expect(screen.getByTestId('calendar-date-text')).toHaveTextContent('Sat 28 Nov 2026');
  });

  it('steps a day with big buttons on each side, across a month end', async () => {
    render(<Harness initial="2026-12-01" steppers />);
    await userEvent.click(screen.getByRole('button', { name: 'Day before the shift date' }));
    expect(screen.getByTestId('value')).toHaveTextContent('2026-11-30');
    await userEvent.click(screen.getByRole('button', { name: 'Day after the shift date' }));
    await userEvent.click(screen.getByRole('button', { name: 'Day after the shift date' }));
    expect(screen.getByTestId('value')).toHaveTextContent('2026-12-02');
  });

  it('clears when asked, and a read-only date cannot be stepped or cleared', async () => {
    const { unmount } = render(<Harness initial="2026-12-01" clearable />);
    await userEvent.click(screen.getByRole('button', { name: 'Clear the shift date' }));
    expect(screen.getByTestId('value')).toBeEmptyDOMElement();
    expect(screen.getByTestId('calendar-date-text')).toHaveTextContent('Choose a date');
    unmount();
    render(<Harness initial="2026-12-01" steppers clearable readOnly />);
    expect(screen.getByRole('button', { name: 'Day before the shift date' })).toBeDisabled();
    expect(screen.queryByRole('button', { name: 'Clear the shift date' })).toBeNull();
    expect(screen.getByLabelText('Shift date')).toHaveAttribute('readonly');
  });
});
