import { OrientationError, parsePlane } from '@roundbook/geomath';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import type { PlaneNotation } from '@/features/rounds/api/types';
import { OrientationField } from '@/features/rounds/components/orientation-field';
import { renderWithProviders } from '@/features/rounds/testing/round-fixtures';

function Harness({ start = 'dip-direction/dip', onEnter }: { start?: PlaneNotation; onEnter?: () => void }) {
  const [text, setText] = useState('');
  const [notation, setNotation] = useState<PlaneNotation>(start);
  return (
    <OrientationField
      label="Orientation of joint 1"
      text={text}
      notation={notation}
      defaultNotation="dip-direction/dip"
      onTextChange={setText}
      onNotationChange={setNotation}
      onEnter={onEnter}
    />
  );
}

/** The parser's own message, to check the field shows exactly that. */
function parserMessage(text: string, notation: PlaneNotation): string {
  try {
    parsePlane(text, { notation });
  } catch (e) {
    if (e instanceof OrientationError) return e.message;
  }
  throw new Error(`${text} was readable`);
}

async function typeIn(text: string, notation?: PlaneNotation) {
  const user = userEvent.setup();
  if (notation !== undefined) {
    await user.selectOptions(screen.getByLabelText('Notation of orientation of joint 1'), notation);
  }
  const input = screen.getByLabelText('Orientation of joint 1');
  await user.clear(input);
  if (text !== '') await user.type(input, text);
  return screen.getByTestId('orientation-feedback');
}

describe('OrientationField', () => {
  it.each<[string, PlaneNotation, string]>([
    ['130/50', 'dip-direction/dip', '130/50 · strike 040° · pole 310/40'],
    ['130 50', 'dip-direction/dip', '130/50 · strike 040° · pole 310/40'],
    ['130,50', 'dip-direction/dip', '130/50'],
    ['130-50', 'dip-direction/dip', '130/50'],
    ['130°/50°', 'dip-direction/dip', '130/50'],
    ['005/08', 'dip-direction/dip', '005/08 · strike 275° · pole 185/82'],
    ['50/130', 'dip/dip-direction', '130/50 · strike 040° · pole 310/40'],
    ['040/50', 'strike/dip-rhr', '130/50 · strike 040° · pole 310/40'],
    ['N30E 40SE', 'dip-direction/dip', '120/40 · strike 030° · pole 300/50'],
    ['n30e 40se', 'strike/dip-rhr', '120/40'],
    ['N30E/40SE', 'dip/dip-direction', '120/40'],
    ['030/40SE', 'dip-direction/dip', '120/40'],
    ['030 40 SE', 'dip-direction/dip', '120/40'],
    ['N30E 40NW', 'dip-direction/dip', '300/40 · strike 210° · pole 120/50'],
    ['N30E 40S', 'dip-direction/dip', '120/40'],
    ['S45W 70NW', 'dip-direction/dip', '315/70 · strike 225° · pole 135/20'],
  ])('reads %s in %s as %s', async (text, notation, expected) => {
    renderWithProviders(<Harness />);
    const feedback = await typeIn(text, notation);
    expect(feedback).toHaveTextContent(expected);
    expect(screen.getByLabelText('Orientation of joint 1')).not.toHaveAttribute('aria-invalid', 'true');
  });

  it.each<[string, string, PlaneNotation]>([
    ['a dip over 90°', '130/95', 'dip-direction/dip'],
    ['an entry that looks swapped', '50/130', 'dip-direction/dip'],
    ['an entry that looks swapped the other way', '130/50', 'dip/dip-direction'],
    ['an azimuth over 360°', '400/50', 'dip-direction/dip'],
    ['a contradictory dip quadrant', 'N30E 40NE', 'dip-direction/dip'],
    ['a quadrant on the strike line', 'N00E 40N', 'dip-direction/dip'],
    ['an incomplete quadrant form', 'N30E 40', 'dip-direction/dip'],
    ['a single number', '130', 'dip-direction/dip'],
    ['words', 'steep', 'dip-direction/dip'],
    ['a leading separator', '-130/50', 'dip-direction/dip'],
    ['a bearing over 90° in a quadrant', 'N95E 40SE', 'dip-direction/dip'],
  ])('shows the parser’s message for %s (%s)', async (_what, text, notation) => {
    renderWithProviders(<Harness />);
    const feedback = await typeIn(text, notation);
    expect(feedback).toHaveTextContent(parserMessage(text, notation));
    expect(screen.getByRole('alert')).toHaveTextContent(parserMessage(text, notation));
    expect(screen.getByLabelText('Orientation of joint 1')).toHaveAttribute('aria-invalid', 'true');
  });

  it('says how to type it while empty, in the chosen notation', async () => {
    renderWithProviders(<Harness />);
    expect(screen.getByTestId('orientation-feedback')).toHaveTextContent(
      'Type it as dip direction / dip, or N30E 40SE',
    );
    const feedback = await typeIn('', 'strike/dip-rhr');
    expect(feedback).toHaveTextContent('Type it as strike / dip (right hand)');
  });

  it('lists the project’s default notation first and moves on with Enter', async () => {
    const onEnter = jest.fn();
    renderWithProviders(<Harness onEnter={onEnter} />);
    const options = screen.getAllByRole('option').map((o) => o.getAttribute('value'));
    expect(options).toEqual(['dip-direction/dip', 'dip/dip-direction', 'strike/dip-rhr']);
    await userEvent.setup().type(screen.getByLabelText('Orientation of joint 1'), '130/50{Enter}');
    expect(onEnter).toHaveBeenCalledTimes(1);
  });
});
