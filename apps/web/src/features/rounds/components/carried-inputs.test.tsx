import { act, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import { RoundEditor } from '@/features/rounds/components/round-editor';
import {
  draftRound,
  heading,
  project,
  renderWithProviders,
  supportClasses,
} from '@/features/rounds/testing/round-fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';

// Issue 19, item 3: Is50, RQD, spacing and inflow typed once in Ground and Joints, carried into the ratings.
beforeEach(() => jest.useFakeTimers());
afterEach(() => {
  jest.clearAllTimers();
  jest.useRealTimers();
  restoreFetch();
});
const setupUser = () => userEvent.setup({ advanceTimers: jest.advanceTimersByTime });

const PUT = 'PUT /api/projects/p-1/rounds/r-1';
const JOINTS = 'GET /api/projects/p-1/headings/h-1/joints';
const RULES = 'GET /api/projects/p-1/trigger-rules';

const joint = (id: string, text: string, spacingM: number | null) => ({
  id,
  kind: 'joint' as const,
  notation: 'dip-direction/dip' as const,
  orientationText: text,
  setLabel: null,
  setOverride: false,
  spacingM,
  persistenceM: null,
  apertureMm: null,
  jr: null,
  jrc: null,
  jrcMethod: null,
  ja: null,
  water: null,
  thicknessM: null,
  dipDirection: null,
  dip: null,
  orientationError: null,
  seq: 1,
  infill: '',
  notes: '',
});

// Two sets: a steep one with spacings, a flat one without.
const round: Round = {
  ...draftRound,
  setParameters: { windowM: 0, count: 2 },
  joints: [
    joint('11111111-1111-4111-8111-111111111111', '137/70', 0.4),
    joint('22222222-2222-4222-8222-222222222222', '139/72', 0.4),
    joint('33333333-3333-4333-8333-333333333333', '300/10', null),
    joint('44444444-4444-4444-8444-444444444444', '305/12', null),
  ],
};

const saves: SaveRoundRequest[] = [];
function api() {
  saves.length = 0;
  mockApi({
    [JOINTS]: [],
    [RULES]: [],
    [PUT]: async (request: Request) => {
      const body = (await request.json()) as SaveRoundRequest;
      saves.push(body);
      return jsonResponse({ ...round, ...body, joints: round.joints, version: body.version + 1 });
    },
  });
}

function renderEditor() {
  return renderWithProviders(
    <RoundEditor
      projectId="p-1"
      round={round}
      project={project}
      heading={heading}
      supportClasses={supportClasses}
      canEdit
    />,
  );
}

describe('Rating inputs carried from Ground and Joints', () => {
  it('carries Is50, inflow per 10 m, spacing and RQD once something is typed, marked with the source', async () => {
    api();
    const user = setupUser();
    renderEditor();
    // Opening the round writes nothing: the empty inputs offer the values.
    await user.click(screen.getByRole('tab', { name: 'Rating' }));
    expect(screen.getByLabelText('Spacing of discontinuities')).toHaveValue('');
    expect(screen.getByTestId('carried-rmr.spacingM')).toHaveTextContent('gives 0.4 m');

    await user.click(screen.getByRole('tab', { name: 'Ground' }));
    await user.type(screen.getByLabelText('Point-load index Is50'), '2.5');
    await user.type(screen.getByLabelText('Water inflow'), '30');
    await user.type(screen.getByLabelText('Tunnel length it comes from'), '10');
    await user.click(screen.getByRole('tab', { name: 'Rating' }));

    expect(screen.getByLabelText('Is50')).toHaveValue('2.5');
    expect(screen.getByTestId('carried-rmr.is50')).toHaveTextContent(
      'carriedfrom Ground: point-load index Is50',
    );
    expect(screen.getByLabelText('Inflow per 10 m')).toHaveValue('30');
    expect(screen.getByTestId('carried-rmr.inflowPer10m')).toHaveTextContent('Ground: water inflow per 10 m');
    expect(screen.getByLabelText('Spacing of discontinuities')).toHaveValue('0.4');
    expect(screen.getByTestId('carried-rmr.spacingM')).toHaveTextContent('set S1');
    // Jv = 1/0.4 = 2.5 → 115 − 3.3·2.5 > 100 → 100 %, optimistic: set S2 has no spacing.
    expect(screen.getByLabelText('RQD')).toHaveValue('100');
    const rqdNote = screen.getByTestId('carried-rmr.rqd');
    expect(rqdNote).toHaveTextContent('Set S2 had no spacing');
    expect(rqdNote).toHaveTextContent('optimistic');
    expect(screen.getByTestId('carried-q.rqd')).toHaveTextContent('carried');
    expect(within(screen.getByTestId('rqd-from-jv')).getByTestId('rqd-optimistic')).toHaveTextContent(
      'Set S2 had no spacing',
    );

    // The Q from the carried RQD says, on its card, that RQD is estimated (issue 19, item 14).
    await user.selectOptions(screen.getByLabelText('Jn from the table'), 'jn-two-random');
    await user.selectOptions(screen.getByLabelText('Jr from the table'), 'jr-smooth-undulating');
    await user.selectOptions(screen.getByLabelText('Ja from the table'), 'ja-stained');
    await user.selectOptions(screen.getByLabelText('Jw from the table'), 'jw-dry');
    await user.selectOptions(screen.getByLabelText('SRF from the table'), 'srf-medium-stress');
    expect(within(screen.getByTestId('rating-q')).getByTestId('rating-q-caution')).toHaveTextContent(
      'RQD estimated from Jv — a correlation, not a measurement.',
    );
    expect(screen.getAllByText('RQD estimated from Jv — a correlation, not a measurement.')).toHaveLength(1);

    // Saved with the carried values.
    await waitFor(() => expect(saves.length).toBeGreaterThan(0), { timeout: 4000 });
    const last = saves[saves.length - 1];
    expect(last.rmrInput).toMatchObject({ rqd: 100, spacingM: 0.4, strength: { is50: 2.5 } });
    expect(last.qInput).toMatchObject({ rqd: 100, rqdFromJv: true });
  });

  it('keeps a value typed over, says what Ground gives, and puts it back on request', async () => {
    api();
    const user = setupUser();
    renderEditor();
    await user.click(screen.getByRole('tab', { name: 'Ground' }));
    await user.type(screen.getByLabelText('Point-load index Is50'), '2.5');
    await user.click(screen.getByRole('tab', { name: 'Rating' }));
    const is50 = screen.getByLabelText('Is50');
    await user.clear(is50);
    await user.type(is50, '3.1');
    expect(is50).toHaveValue('3.1');
    const note = screen.getByTestId('carried-rmr.is50');
    expect(note).toHaveTextContent('Typed here. Ground: point-load index Is50 gives 2.5 MPa.');

    // Ground changes: the typed value stays.
    await user.click(screen.getByRole('tab', { name: 'Ground' }));
    await user.clear(screen.getByLabelText('Point-load index Is50'));
    await user.type(screen.getByLabelText('Point-load index Is50'), '2.7');
    await user.click(screen.getByRole('tab', { name: 'Rating' }));
    expect(screen.getByLabelText('Is50')).toHaveValue('3.1');
    await user.click(
      within(screen.getByTestId('carried-rmr.is50')).getByRole('button', { name: 'Use 2.7 MPa' }),
    );
    expect(screen.getByLabelText('Is50')).toHaveValue('2.7');
    expect(screen.getByTestId('carried-rmr.is50')).toHaveTextContent('carried');
    await act(() => jest.advanceTimersByTimeAsync(2000));
  });
});
