import { formatCalendarDate, formatProjectTime } from '@roundbook/domain';
import { Q_JA_TABLE, Q_SRF_TABLE, RMR89_CONDITION_SIMPLE, STRENGTH_GRADES } from '@roundbook/geomath';
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Round } from '@/features/rounds/api/types';
import { RoundEditor } from '@/features/rounds/components/round-editor';
import {
  draftRound,
  heading,
  project,
  renderWithProviders,
  supportClasses,
} from '@/features/rounds/testing/round-fixtures';
import { mockApi, restoreFetch } from '@/testing/mock-api';

// Issue 19 item 11: a round that cannot be edited reads as a summary of label and value, not a disabled form.

afterEach(() => restoreFetch());

const JOINTS = 'GET /api/projects/p-1/headings/h-1/joints';
const RULES = 'GET /api/projects/p-1/trigger-rules';

const ja = Q_JA_TABLE.rows.find((r) => r.id === 'ja-slightly-altered');
const strong = STRENGTH_GRADES.isrm.find((g) => g.code === 'R4');
const condition = RMR89_CONDITION_SIMPLE[1];
if (ja === undefined || strong === undefined) throw new Error('the tables changed');

const joint = {
  id: '11111111-1111-4111-8111-111111111111',
  kind: 'fault' as const,
  notation: 'strike/dip-rhr' as const,
  orientationText: '040/50',
  setLabel: null,
  setOverride: false,
  spacingM: 0.4,
  persistenceM: 6,
  apertureMm: 2,
  jr: 1.5,
  jrc: 8,
  jrcMethod: 'profile-comb' as const,
  ja: 2,
  water: 'dripping' as const,
  thicknessM: 0.3,
  dipDirection: 130,
  dip: 50,
  orientationError: null,
  seq: 1,
  infill: 'Soft clay, wet, squeezes out between the fingers',
  notes: 'Runs from the left shoulder to the invert',
};

const submitted: Round = {
  ...draftRound,
  status: 'submitted',
  shift: 'night',
  shiftDate: '2026-12-01',
  submittedAt: '2026-12-02T05:10:00Z',
  distantParts: 'Crown above the spiling',
  ground: {
    ...draftRound.ground,
    units: [
      {
        name: 'Invented grey gneiss',
        sharePercent: 100,
        weatheringGrade: 'WII',
        strengthGrade: 'R4',
      },
    ],
    pointLoadIs50: 3.2,
    inflowLpm: 12,
    inflowLengthM: 20,
  },
  joints: [joint],
  qInput: { rqd: 75, jn: 9, jr: 1.5, ja: 2, jw: 1, srf: 1, rows: { ja: 'ja-slightly-altered' } },
  rmrInput: {
    strength: { kind: 'point-load', is50: 3.2 },
    rqd: 75,
    spacingM: 0.4,
    condition: { kind: 'simple', condition: condition.id },
    groundwater: { kind: 'inflow', litresPerMinutePer10m: 6 },
    orientation: { kind: 'assessment', assessment: 'fair' },
  },
  recommendedClassId: 'c-B',
  nextRoundLength: 3,
  recommendationReason: 'Wet fault zone across the face: bolt the left shoulder first.',
  suggestedClassIds: ['c-B'],
};

function renderRound(round: Round, canEdit: boolean) {
  mockApi({ [JOINTS]: [], [RULES]: [] });
  return renderWithProviders(
    <RoundEditor
      projectId="p-1"
      round={round}
      project={project}
      heading={heading}
      supportClasses={supportClasses}
      canEdit={canEdit}
    />,
  );
}

const sections = () => screen.getByRole('tablist', { name: 'Sections of the round' });

describe('A read-only round is a summary', () => {
  it('says the shift in words and gives the chainages and times by the domain formatters', () => {
    renderRound(submitted, true);
    const position = screen.getByTestId('summary-position');
    expect(within(position).getByTestId('summary-shift')).toHaveTextContent(/^Night shift$/);
    expect(position).toHaveTextContent(formatCalendarDate('2026-12-01'));
    expect(position).toHaveTextContent(formatProjectTime(submitted.mappedAt, project.timeZone));
    // km+m with the heading's one decimal (geomath's chainage, as every other screen).
    expect(position).toHaveTextContent('1+253.5');
    expect(position).toHaveTextContent('1+250.0');
    expect(position).toHaveTextContent('Crown above the spiling');
  });

  it('the day shift reads differently from the night shift', () => {
    renderRound({ ...submitted, shift: 'day' }, true);
    expect(screen.getByTestId('summary-shift')).toHaveTextContent(/^Day shift$/);
  });

  it('has no inputs, dropdowns or disabled controls in any section', async () => {
    renderRound(submitted, true);
    const user = userEvent.setup();
    for (const name of ['Position', 'Ground', 'Joints', 'Rating', 'Support']) {
      await user.click(within(sections()).getByRole('tab', { name }));
      const summary = screen.getByTestId(`summary-${name.toLowerCase()}`);
      expect(summary.querySelectorAll('input, select, textarea')).toHaveLength(0);
      expect(summary.querySelectorAll('[disabled], [aria-disabled="true"]')).toHaveLength(0);
      expect(screen.queryByRole('button', { name: /Submit for review/ })).toBeNull();
    }
  });

  it('gives each choice its full meaning', async () => {
    renderRound(submitted, true);
    const user = userEvent.setup();
    await user.click(within(sections()).getByRole('tab', { name: 'Ground' }));
    const ground = screen.getByTestId('summary-ground');
    expect(within(ground).getByRole('table', { name: 'Rock units' })).toHaveTextContent(
      `R4 strong — ${strong.hint}`,
    );
    expect(ground).toHaveTextContent('3.2 MPa');

    await user.click(within(sections()).getByRole('tab', { name: 'Rating' }));
    // The whole row of the table, never cut: "Ja 2 · Slightly altered joint walls, … (φr …)".
    expect(screen.getByTestId('summary-q-ja')).toHaveTextContent(
      `Ja 2 · ${ja.description}${ja.extra ? ` (${ja.extra})` : ''}`,
    );
    const rating = screen.getByTestId('summary-rating');
    expect(rating).toHaveTextContent(`${condition.rating} · ${condition.description}`);
    expect(rating).toHaveTextContent('Fair (-5)');
    // RQD typed without a table row reads as typed; a value saved without its row gets the meaning of the
    // rows that give it (SRF 1: only the medium-stress row of the table).
    expect(screen.getByTestId('summary-q-rqd')).toHaveTextContent(/^RQD 75 %$/);
    const srf = Q_SRF_TABLE.rows.filter((r) => r.value === 1);
    expect(srf).toHaveLength(1);
    expect(screen.getByTestId('summary-q-srf')).toHaveTextContent(`SRF 1 · ${srf[0].description}`);

    await user.click(within(sections()).getByRole('tab', { name: 'Support' }));
    const support = screen.getByTestId('summary-support');
    expect(within(support).getByTestId('summary-class')).toHaveTextContent('B');
    expect(support).toHaveTextContent('Fits the ratings');
    expect(support).toHaveTextContent('Wet fault zone across the face: bolt the left shoulder first.');
    expect(support).toHaveTextContent('3 m');
  });

  it('shows the joints as a table with every recorded field', async () => {
    renderRound(submitted, true);
    const user = userEvent.setup();
    await user.click(within(sections()).getByRole('tab', { name: 'Joints' }));
    const table = screen.getByRole('table', { name: 'Joints of this face' });
    const [row] = within(table).getAllByTestId('summary-joint');
    // Strike 040 right-hand rule, dip 50: dip direction 130.
    expect(row).toHaveTextContent('130/50 (typed 040/50)');
    for (const words of [
      'Fault',
      '0.4 m',
      '6 m',
      '2 mm',
      '8 (profile gauge)',
      'Dripping',
      'Infill: Soft clay, wet, squeezes out between the fingers',
      '0.3 m thick',
      'Runs from the left shoulder to the invert',
    ])
      expect(row).toHaveTextContent(words);
  });

  it('is a summary for a person who does not map rounds, even on a draft', () => {
    renderRound(draftRound, false);
    expect(screen.getByTestId('summary-position')).toBeInTheDocument();
    expect(screen.queryByLabelText('Parts of the face seen only from a distance')).toBeNull();
  });

  it('keeps the form for the geologist on a draft', () => {
    renderRound(draftRound, true);
    expect(screen.queryByTestId('summary-position')).toBeNull();
    expect(screen.getByLabelText('Parts of the face seen only from a distance')).not.toHaveAttribute(
      'readonly',
    );
  });
});
