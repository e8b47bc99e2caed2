import { formatProjectTime, formatQ } from '@roundbook/domain';
import { qValue, Q_EDITION, RMR_ORIENTATION_RULE } from '@roundbook/geomath';
import { act, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import { RoundEditor, type RoundEditorProps } from '@/features/rounds/components/round-editor';
import { roundDraftsFor } from '@/features/rounds/hooks/use-round-autosave';
import { formValuesOf } from '@/features/rounds/schemas/round-form';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import {
  draftRound,
  heading,
  project,
  renderWithProviders,
  supportClasses,
} from '@/features/rounds/testing/round-fixtures';
import { clearSession, saveSession } from '@/lib/session';
import type { LocalDraft } from '@/lib/sync/local-draft';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';

const roundDrafts = roundDraftsFor(null);
const readLocalDraft = (roundId: string) => roundDrafts.read(roundId);
const writeLocalDraft = ({
  roundId,
  ...draft
}: Omit<LocalDraft<RoundFormValues>, 'key'> & { roundId: string }) =>
  roundDrafts.write({ key: roundId, ...draft });

// The autosave pause (1.5 s) and its retries run on Jest's fake clock: no test waits in real time.
beforeEach(() => jest.useFakeTimers());
afterEach(() => {
  jest.clearAllTimers();
  jest.useRealTimers();
  restoreFetch();
});
/** user-event on the fake clock (its typing delays advance it). */
const setupUser = () => userEvent.setup({ advanceTimers: jest.advanceTimersByTime });
/** Lets fake time pass, with React's updates flushed. */
const pass = (ms: number) => act(() => jest.advanceTimersByTimeAsync(ms));

const PUT = 'PUT /api/projects/p-1/rounds/r-1';
const JOINTS = 'GET /api/projects/p-1/headings/h-1/joints';
const SUBMIT = 'POST /api/projects/p-1/rounds/r-1/submit';

/** The API's answer to a save: the record as sent, one version on. */
function savedFrom(body: SaveRoundRequest, base: Round = draftRound): Round {
  return {
    ...base,
    ...body,
    joints: body.joints.map((j, i) => ({
      ...j,
      id: `j-${i}`,
      seq: i + 1,
      dipDirection: null,
      dip: null,
      orientationError: null,
    })),
    version: body.version + 1,
  };
}

function renderEditor(
  round: Round = draftRound,
  canEdit = true,
  orientationSlot?: RoundEditorProps['orientationSlot'],
) {
  return renderWithProviders(
    <RoundEditor
      projectId="p-1"
      round={round}
      project={project}
      heading={heading}
      supportClasses={supportClasses}
      canEdit={canEdit}
      orientationSlot={orientationSlot}
    />,
  );
}

const saves: SaveRoundRequest[] = [];
function saveHandler(answer?: (body: SaveRoundRequest) => Response) {
  saves.length = 0;
  return async (request: Request) => {
    const body = (await request.json()) as SaveRoundRequest;
    saves.push(body);
    return answer ? answer(body) : jsonResponse(savedFrom(body));
  };
}

const distantField = () => screen.getByLabelText('Parts of the face seen only from a distance');

describe('Round editor: nothing lost', () => {
  it('prints the time the round was opened with the domain formatter, in the project time zone (issue 19 item 7)', () => {
    mockApi({ [JOINTS]: [] });
    renderEditor({ ...draftRound, mappedAt: '2026-12-01T23:30:00Z' });
    const when = formatProjectTime('2026-12-01T23:30:00Z', project.timeZone);
    expect(when).toBe('1 Dec 2026, 23:30');
    expect(screen.getByText(when)).toBeInTheDocument();
  });

  it('keeps the typing in the browser at once and saves it 1.5 s after the last change', async () => {
    mockApi({ [JOINTS]: [], [PUT]: saveHandler() });
    renderEditor();
    expect(screen.getByTestId('save-state')).toHaveTextContent('Saved');
    await setupUser().type(distantField(), 'Crown behind the jumbo');

    expect(screen.getByTestId('save-state')).toHaveTextContent('Not saved yet');
    expect(readLocalDraft('r-1')?.values.distantParts).toBe('Crown behind the jumbo');
    expect(readLocalDraft('r-1')?.baseVersion).toBe(3);
    expect(saves).toHaveLength(0);

    await waitFor(() => expect(screen.getByTestId('save-state')).toHaveTextContent('Saved'), {
      timeout: 4000,
    });
    expect(saves).toHaveLength(1);
    expect(saves[0]).toMatchObject({
      version: 3,
      distantParts: 'Crown behind the jumbo',
      faceChainage: 1253.5,
    });
    expect(readLocalDraft('r-1')).toBeNull();
  });

  it('restores unsaved typing after a reload, says so, and sends it', async () => {
    writeLocalDraft({
      roundId: 'r-1',
      baseVersion: 3,
      savedAt: Date.parse('2026-12-01T09:00:00Z'),
      values: { ...formValuesOf(draftRound), distantParts: 'Left wall seen from the muck pile' },
    });
    mockApi({ [JOINTS]: [], [PUT]: saveHandler() });
    renderEditor();
    expect(await screen.findByTestId('restored-note')).toHaveTextContent('restored from this device');
    expect(distantField()).toHaveValue('Left wall seen from the muck pile');
    await waitFor(() => expect(saves).toHaveLength(1), { timeout: 4000 });
    expect(saves[0]).toMatchObject({ version: 3, distantParts: 'Left wall seen from the muck pile' });
    await waitFor(() => expect(screen.getByTestId('save-state')).toHaveTextContent('Saved'));
    expect(readLocalDraft('r-1')).toBeNull();
  });

  it('shows "not saved yet — will retry" when the server cannot be reached, and keeps the typing', async () => {
    mockApi({ [JOINTS]: [], [PUT]: () => Promise.reject(new TypeError('Failed to fetch')) });
    renderEditor();
    await setupUser().type(distantField(), 'Invert under water');
    expect(await screen.findByTestId('offline-note', {}, { timeout: 4000 })).toHaveTextContent(
      'Not saved yet — will retry',
    );
    expect(screen.getByTestId('save-state')).toHaveTextContent('Not saved yet — will retry');
    expect(readLocalDraft('r-1')?.values.distantParts).toBe('Invert under water');
  });
});

describe('Round editor: changed by someone else (409 STALE_VERSION)', () => {
  const theirs: Round = {
    ...draftRound,
    version: 4,
    distantParts: 'Whole face seen close up',
    faceChainage: 1254,
  };
  const stale = () =>
    jsonResponse(
      { code: 'STALE_VERSION', message: 'Someone saved this round first.', details: { current: theirs } },
      409,
    );

  it('merges field by field: their face chainage comes in, my notes stay by default, and the merge is saved on their version', async () => {
    let calls = 0;
    mockApi({
      [JOINTS]: [],
      [PUT]: saveHandler((body) => {
        calls += 1;
        return calls === 1 ? stale() : jsonResponse(savedFrom(body, theirs));
      }),
    });
    renderEditor();
    const user = setupUser();
    await user.type(distantField(), 'Crown only');
    const view = await screen.findByTestId('conflict-view', {}, { timeout: 4000 });
    expect(view).toHaveTextContent('Someone saved this round first.');
    // Only they changed the face chainage: taken without a question.
    expect(within(view).getByTestId('merged-theirs')).toHaveTextContent('Face chainage');
    // Both changed the distant parts: both values shown, mine chosen until I say otherwise.
    const fields = within(view).getAllByTestId('conflict-field');
    expect(fields).toHaveLength(1);
    expect(fields[0]).toHaveTextContent('Parts of the face seen only from a distance');
    expect(within(fields[0]).getByRole('radio', { name: 'Yours: Crown only' })).toBeChecked();
    expect(
      within(fields[0]).getByRole('radio', { name: 'Theirs: Whole face seen close up' }),
    ).not.toBeChecked();
    expect(screen.getByTestId('save-state')).toHaveTextContent('changed by someone else');
    expect(saves).toHaveLength(1);

    // The main button is the merge (never "load theirs").
    const primary = within(view).getByRole('button', { name: 'Save the merge' });
    await user.click(primary);
    await waitFor(() => expect(saves).toHaveLength(2));
    expect(saves[1]).toMatchObject({ version: 4, distantParts: 'Crown only', faceChainage: 1254 });
    await waitFor(() => expect(screen.getByTestId('save-state')).toHaveTextContent('Saved'));
    expect(distantField()).toHaveValue('Crown only');
    expect(screen.getByLabelText('Face chainage')).toHaveValue('1+254.0');
  });

  it('takes their value for a field when chosen, keeping the rest of the merge', async () => {
    let calls = 0;
    mockApi({
      [JOINTS]: [],
      [PUT]: saveHandler((body) => {
        calls += 1;
        return calls === 1 ? stale() : jsonResponse(savedFrom(body, theirs));
      }),
    });
    renderEditor();
    const user = setupUser();
    await user.type(distantField(), 'Crown only');
    const view = await screen.findByTestId('conflict-view', {}, { timeout: 4000 });
    await user.click(within(view).getByRole('radio', { name: 'Theirs: Whole face seen close up' }));
    await user.click(within(view).getByRole('button', { name: 'Save the merge' }));
    expect(distantField()).toHaveValue('Whole face seen close up');
    // Nothing differs from their version any more: nothing needs sending.
    await pass(1800);
    expect(saves).toHaveLength(1);
    expect(screen.getByTestId('save-state')).toHaveTextContent('Saved');
  });

  it('puts their version in the form only on the explicit discard, without saving over it', async () => {
    mockApi({ [JOINTS]: [], [PUT]: saveHandler(stale) });
    renderEditor();
    const user = setupUser();
    await user.type(distantField(), 'Crown only');
    const view = await screen.findByTestId('conflict-view', {}, { timeout: 4000 });
    await user.click(within(view).getByRole('button', { name: 'Discard my typing and load theirs' }));
    expect(distantField()).toHaveValue('Whole face seen close up');
    expect(screen.getByLabelText('Face chainage')).toHaveValue('1+254.0');
    expect(screen.getByTestId('save-state')).toHaveTextContent('Saved');
    expect(readLocalDraft('r-1')).toBeNull();
    await pass(1800);
    expect(saves).toHaveLength(1);
  });
});

describe('Round editor: rating and submit', () => {
  it('shows Q from geomath with its inputs, the edition and the orientation rule', async () => {
    mockApi({ [JOINTS]: [], [PUT]: saveHandler() });
    renderEditor();
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Rating' }));
    expect(screen.getByText(`Tables: ${Q_EDITION.name}.`, { exact: false })).toBeInTheDocument();
    await user.selectOptions(screen.getByLabelText('RQD from the table'), 'rqd-fair');
    await user.selectOptions(screen.getByLabelText('Jn from the table'), 'jn-two-random');
    await user.selectOptions(screen.getByLabelText('Jr from the table'), 'jr-smooth-undulating');
    await user.selectOptions(screen.getByLabelText('Ja from the table'), 'ja-stained');
    await user.selectOptions(screen.getByLabelText('Jw from the table'), 'jw-dry');
    await user.selectOptions(screen.getByLabelText('SRF from the table'), 'srf-medium-stress');
    const q = qValue({ rqd: 62.5, jn: 6, jr: 2, ja: 1, jw: 1, srf: 1 });
    const card = screen.getByTestId('rating-q');
    // Q as every screen prints it (domain formatQ: whole numbers from 10; issue 19 item 7).
    expect(card).toHaveTextContent(`Q${formatQ(q.q)}`);
    expect(card).toHaveTextContent(q.rockClass);
    expect(card).toHaveTextContent(`RQD used${q.rqdUsed}`);
    expect(card).toHaveTextContent(`Jn used${q.jnUsed}`);
    expect(card).toHaveTextContent(`Jr used${q.jrUsed}`);
    expect(card).toHaveTextContent('Not on the server yet.');
    expect(screen.getByTestId('orientation-suggestion')).toHaveTextContent(RMR_ORIENTATION_RULE);
    // Cautions sit beside what they qualify, once; the footer is one short line (issue 19, item 14).
    expect(screen.getByTestId('rating-cautions')).toHaveTextContent(
      'Ratings are empirical aids: they do not prove any support adequate; the responsible engineer and the competent person decide.',
    );
    expect(screen.getAllByText(/Other editions give other values/)).toHaveLength(2);
    expect(screen.queryByTestId('rating-q-caution')).toBeNull();
    // No developer text on screen (issue 19, item 6): sources and option names stay in the code.
    expect(screen.getByRole('region', { name: 'Rating' })).not.toHaveTextContent(
      /from memory|qValue|option jr/,
    );
    expect(screen.getByLabelText('Ja from the table')).toHaveTextContent('φr 25–35°');
    await waitFor(() => expect(saves).toHaveLength(1), { timeout: 4000 });
    expect(saves[0].qInput).toMatchObject({ rqd: 62.5, jn: 6, jr: 2, ja: 1, jw: 1, srf: 1 });
  });

  it('puts the reasons a submit is refused on the sections and fields they belong to', async () => {
    mockApi({
      [JOINTS]: [],
      [PUT]: saveHandler(),
      [SUBMIT]: () =>
        jsonResponse(
          {
            code: 'VALIDATION_FAILED',
            message: 'The round is not ready to submit: Fix the orientation of joint 2 before submitting.',
            fields: {
              joints: 'Fix the orientation of joint 2 before submitting.',
              ratings: 'Rate the rock mass (Q or RMR89) before submitting.',
              nextRoundLength: 'Give the length of the next round.',
            },
          },
          400,
        ),
    });
    renderEditor({ ...draftRound, suggestedClassIds: ['c-B'] });
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Support' }));
    expect(screen.getByTestId('support-caution')).toHaveTextContent('Nobody enters unsupported ground.');
    const classes = screen.getAllByTestId('support-class');
    expect(classes.map((c) => c.textContent?.slice(0, 1))).toEqual(['B', 'A', 'C']);
    expect(classes[0]).toHaveTextContent('Fits the ratings');

    await user.click(screen.getByRole('button', { name: 'Submit for review' }));
    // The first section named is opened, with its message.
    expect(await screen.findByTestId('joints-error')).toHaveTextContent('Fix the orientation of joint 2');
    const tabs = screen.getByRole('tablist', { name: 'Sections of the round' });
    for (const name of ['Joints', 'Rating', 'Support']) {
      expect(within(tabs).getByRole('tab', { name: new RegExp(name) })).toHaveTextContent('!');
    }
    expect(within(tabs).getByRole('tab', { name: /Position/ })).not.toHaveTextContent('!');
    await user.click(within(tabs).getByRole('tab', { name: /Rating/ }));
    expect(screen.getByTestId('ratings-error')).toHaveTextContent('Rate the rock mass');
    await user.click(within(tabs).getByRole('tab', { name: /Support/ }));
    expect(screen.getByText('Give the length of the next round.')).toBeInTheDocument();
    expect(screen.getByTestId('submit-error')).toHaveTextContent('The marked sections say what is missing.');
  });

  it('is read only for people who do not map rounds', () => {
    mockApi({ [JOINTS]: [] });
    renderEditor(draftRound, false);
    expect(screen.getByText('Read only')).toBeInTheDocument();
    // Read as a summary (issue 19 item 11), not a form: nothing to type into.
    expect(screen.getByTestId('summary-position')).toBeInTheDocument();
    expect(screen.queryByLabelText('Parts of the face seen only from a distance')).toBeNull();
  });
});

describe('Round editor: a draft from this device that the server has moved past', () => {
  it('does not send it; it shows both versions for a choice', async () => {
    writeLocalDraft({
      roundId: 'r-1',
      baseVersion: 2,
      savedAt: Date.parse('2026-12-01T09:00:00Z'),
      values: { ...formValuesOf(draftRound), distantParts: 'Typed offline yesterday' },
    });
    mockApi({ [JOINTS]: [], [PUT]: saveHandler() });
    renderEditor();
    expect(await screen.findByTestId('restored-note')).toHaveTextContent('saved again since then');
    const view = screen.getByTestId('conflict-view');
    // An old draft without its starting version: every difference is a question, mine chosen.
    expect(within(view).getByRole('radio', { name: 'Yours: Typed offline yesterday' })).toBeChecked();
    expect(distantField()).toHaveValue('Typed offline yesterday');
    await pass(1800);
    expect(saves).toHaveLength(0);
  });
});

describe('Round editor: one assessment for the sets and the trigger level', () => {
  const RULES = 'GET /api/projects/p-1/trigger-rules';
  const joint = (id: string, text: string, extra: Partial<Round['joints'][number]> = {}) => ({
    id,
    kind: 'joint' as const,
    notation: 'dip-direction/dip' as const,
    orientationText: text,
    setLabel: null,
    setOverride: false,
    spacingM: 0.4,
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
    ...extra,
  });
  // Steep joints striking along the 047° drive: very unfavourable for the drive (RMR89 Table 4.1, note 6).
  const round: Round = {
    ...draftRound,
    setParameters: { windowM: 25, count: 1 },
    joints: [
      joint('11111111-1111-4111-8111-111111111111', '137/70'),
      joint('22222222-2222-4222-8222-222222222222', '139/72'),
      joint('33333333-3333-4333-8333-333333333333', '020/30', { setLabel: 'S7', setOverride: true }),
    ],
  };
  const nearby = [
    {
      id: 'n-1',
      roundId: 'r-0',
      roundNumber: 41,
      faceChainage: 1250,
      kind: 'joint',
      setLabel: 'S1',
      dipDirection: 135,
      dip: 69,
    },
    {
      id: 'n-2',
      roundId: 'r-0',
      roundNumber: 41,
      faceChainage: 1250,
      kind: 'joint',
      setLabel: 'S1',
      dipDirection: 138,
      dip: 71,
    },
  ];
  const rule = {
    id: 'tr-1',
    watch: 'adverse-orientation',
    comparison: null,
    threshold: null,
    level: 'amber',
    ownerRole: 'engineer',
    action: 'Check the bolting against the set.',
    timeAllowedHours: 4,
    enabled: true,
    summary: 'A set or feature adverse to the drive → amber',
    version: 1,
  };

  it('shows the sets found with the earlier round and the trigger that fires on the same set, live', async () => {
    mockApi({ [JOINTS]: nearby, [RULES]: [rule], [PUT]: saveHandler() });
    renderEditor(round);
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    const table = await screen.findByTestId('sets-table');
    const cellsOf = (row: number) =>
      [...within(table).getAllByRole('row')[row].querySelectorAll('th, td')].map((c) => c.textContent);
    // Two joints here and two of the earlier round within 25 m: one set of four.
    await waitFor(() => expect(cellsOf(1).slice(0, 3)).toEqual(['S1', expect.any(String), '4 (2)']));
    // The geologist's own set is kept, marked as such; the others follow the assessment.
    expect(screen.getByLabelText('Set of joint 1')).toHaveValue('S1');
    expect(screen.getByLabelText('Set of joint 2')).toHaveValue('S1');
    expect(screen.getByLabelText('Set of joint 3')).toHaveValue('S7');
    expect(screen.getByText('yours')).toBeInTheDocument();
    expect(within(table).getByRole('rowheader', { name: 'S7' })).toBeInTheDocument();

    const panel = screen.getByTestId('trigger-panel');
    expect(panel).toHaveTextContent('As typed; saved with the round.');
    const firing = within(panel).getByTestId('trigger-firing');
    // The same set S1, by the same mean the sets table shows.
    const [dipDirection, dip] = (cellsOf(1)[1] ?? '').split('/').map(Number);
    const said = /S1 \((\d{3})\/(\d{2})\) is very unfavourable for the drive/.exec(firing.textContent ?? '');
    expect(said).not.toBeNull();
    expect(Math.abs(Number(said?.[1]) - dipDirection)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(Number(said?.[2]) - dip)).toBeLessThanOrEqual(0.5);
    // Nothing is written back into the record by the screen: the only save is the one the typing makes.
    expect(saves).toHaveLength(0);
  });

  it('shows a submitted round with the trigger level it was submitted with, never a live recomputation', async () => {
    mockApi({ [JOINTS]: nearby, [RULES]: [rule], [PUT]: saveHandler() });
    renderEditor({ ...round, status: 'submitted', triggerLevel: 'green', triggerFirings: [] }, false);
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    await screen.findByTestId('sets-table');
    const panel = screen.getByTestId('trigger-panel');
    expect(panel).not.toHaveTextContent('As typed');
    expect(within(panel).queryByTestId('trigger-firing')).toBeNull();
  });

  it('hands the orientation slot the joints as typed and the same live sets the table shows', async () => {
    mockApi({ [JOINTS]: nearby, [RULES]: [rule], [PUT]: saveHandler() });
    renderEditor(round, true, ({ joints, assessment }) => (
      <p data-testid="slot">{`${joints.length} joints; sets ${assessment.sets.sets.map((x) => x.label).join(',')}`}</p>
    ));
    expect(screen.queryByTestId('slot')).toBeNull(); // only under the joints
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    await waitFor(() => expect(screen.getByTestId('slot')).toHaveTextContent(/^3 joints; sets .*S1/));
  });

  // The orientation panel (app/routes composes it) hands the poles chosen on the net to assignSets.
  const assignSlot: RoundEditorProps['orientationSlot'] = ({ joints, assignSets }) =>
    assignSets === null ? (
      <p>read only</p>
    ) : (
      <>
        <button onClick={() => assignSets([joints[0].id, joints[1].id], 'S7')}>two into S7</button>
        <button onClick={() => assignSets([joints[2].id], null)}>third out</button>
      </>
    );

  it('puts joints chosen on the net in a set, or out of every set, as the geologist’s own (saved as you go)', async () => {
    mockApi({ [JOINTS]: nearby, [RULES]: [rule], [PUT]: saveHandler() });
    renderEditor(round, true, assignSlot);
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    await waitFor(() => expect(screen.getByLabelText('Set of joint 1')).toHaveValue('S1'));
    expect(screen.getAllByText('yours')).toHaveLength(1);
    await user.click(screen.getByRole('button', { name: 'two into S7' }));
    // The Joints list shows them in S7 as the geologist's own, and the autosave sends it.
    expect(screen.getByLabelText('Set of joint 1')).toHaveValue('S7');
    expect(screen.getByLabelText('Set of joint 2')).toHaveValue('S7');
    expect(screen.getAllByText('yours')).toHaveLength(3);
    await waitFor(() => expect(saves).toHaveLength(1), { timeout: 4000 });
    expect(saves[0].joints.map((j) => [j.setLabel, j.setOverride])).toEqual([
      ['S7', true],
      ['S7', true],
      ['S7', true],
    ]);
    // Joint 3 out of its set: random, still the geologist's own choice; S7 keeps the other two.
    await user.click(screen.getByRole('button', { name: 'third out' }));
    expect(screen.getByLabelText('Set of joint 3')).toHaveValue('');
    await waitFor(() => expect(saves).toHaveLength(2), { timeout: 4000 });
    expect(saves[1].joints[2]).toMatchObject({ setLabel: null, setOverride: true });
    const table = screen.getByTestId('sets-table');
    expect(within(table).getByRole('rowheader', { name: 'S7' })).toBeInTheDocument();
    expect(within(table).queryByRole('rowheader', { name: 'S1' })).toBeNull();
  });

  it('gives the orientation slot no way to assign sets on a round the person cannot edit', async () => {
    mockApi({ [JOINTS]: nearby, [RULES]: [rule], [PUT]: saveHandler() });
    renderEditor(
      { ...round, status: 'submitted', triggerLevel: 'green', triggerFirings: [] },
      false,
      assignSlot,
    );
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    expect(await screen.findByText('read only')).toBeInTheDocument();
  });

  it('keeps the set parameters with the round: a new window is saved and the sets follow it', async () => {
    const api = mockApi({ [JOINTS]: nearby, [RULES]: [rule], [PUT]: saveHandler() });
    renderEditor(round);
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    const table = await screen.findByTestId('sets-table');
    await waitFor(() => expect(within(table).getAllByRole('row')[1]).toHaveTextContent('4 (2)'));
    await user.selectOptions(screen.getByLabelText('Earlier rounds within'), '0');
    // This round only: the two joints here make the set, and no earlier round is read for it.
    expect(within(screen.getByTestId('sets-table')).getAllByRole('row')[1]).toHaveTextContent('2 (2)');
    await waitFor(() => expect(saves).toHaveLength(1), { timeout: 4000 });
    expect(saves[0].setParameters).toEqual({ windowM: 0, count: 1 });
    expect(requestedRoutes(api).filter((r) => r === JOINTS)).toHaveLength(1);
  });
});

describe('Round editor: another device saves the round (polling every 10 s)', () => {
  const GET = 'GET /api/projects/p-1/rounds/r-1';
  const AUDIT = 'GET /api/projects/p-1/audit';
  const theirs: Round = {
    ...draftRound,
    version: draftRound.version + 1,
    distantParts: 'Left wall behind the jumbo',
  };
  const audit = [
    {
      id: 'e-1',
      entityType: 'round',
      entityId: 'r-1',
      action: 'update',
      actorId: 'u-2',
      actorName: 'Ailsa Drummond',
      at: '2026-12-03T10:00:00Z',
      lastAt: null,
      coalesced: 0,
      before: { distantParts: '' },
      after: { distantParts: 'Left wall behind the jumbo' },
    },
  ];

  it('takes their version when nothing is unsaved here, and says who changed what', async () => {
    let version = draftRound;
    const mock = mockApi({ [JOINTS]: [], [GET]: () => jsonResponse(version), [AUDIT]: audit });
    renderEditor();
    await pass(10_000);
    expect(requestedRoutes(mock).filter((r) => r === GET)).toHaveLength(1);
    expect(screen.queryByTestId('refreshed-note')).toBeNull();

    version = theirs;
    await pass(10_000);
    const note = await screen.findByTestId('refreshed-note');
    expect(note).toHaveTextContent('Ailsa Drummond saved this round');
    expect(note).toHaveTextContent('changed: Parts of the face seen only from a distance');
    expect(distantField()).toHaveValue('Left wall behind the jumbo');
    expect(screen.getByTestId('save-state')).toHaveTextContent('Saved');
  });

  it('never overwrites unsaved typing: it shows the conflict with both values instead', async () => {
    mockApi({
      [JOINTS]: [],
      [GET]: () => jsonResponse(theirs),
      [AUDIT]: audit,
      // The save cannot get through: the typing stays unsaved on this device.
      [PUT]: () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderEditor();
    const user = setupUser();
    await user.type(distantField(), 'Crown only');
    await pass(10_000);
    const view = await screen.findByTestId('conflict-view');
    expect(view).toHaveTextContent('Ailsa Drummond saved this round while you were typing');
    expect(within(view).getByRole('radio', { name: 'Yours: Crown only' })).toBeChecked();
    expect(
      within(view).getByRole('radio', { name: 'Theirs: Left wall behind the jumbo' }),
    ).toBeInTheDocument();
    expect(distantField()).toHaveValue('Crown only');
    expect(readLocalDraft('r-1')?.values.distantParts).toBe('Crown only');
  });

  it('does not ask while the browser is offline or the page is hidden', async () => {
    const mock = mockApi({ [JOINTS]: [], [GET]: () => jsonResponse(theirs), [AUDIT]: audit });
    const online = jest.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
    renderEditor();
    await pass(30_000);
    online.mockReturnValue(true);
    const hidden = jest.spyOn(document, 'visibilityState', 'get').mockReturnValue('hidden');
    await pass(30_000);
    expect(requestedRoutes(mock).filter((r) => r === GET)).toHaveLength(0);
    hidden.mockRestore();
    online.mockRestore();
  });
});

describe('Round editor: typing kept after the session ran out offline', () => {
  const session = (id: string, name: string) =>
    saveSession({
      accessToken: `token-${id}`,
      expiresAt: '2099-01-01T00:00:00Z',
      user: { id, name, email: `${id}@example.test` },
    });
  const keepDraftOf = (owner: string) =>
    roundDraftsFor(owner).write({
      key: 'r-1',
      baseVersion: draftRound.version,
      savedAt: Date.parse('2026-12-03T08:00:00Z'),
      values: { ...formValuesOf(draftRound), distantParts: 'Typed before the session ran out' },
    });
  afterEach(() => clearSession());

  it('is not restored or sent when a different person signs in on the device', async () => {
    keepDraftOf('u-a');
    session('u-b', 'Ailsa Drummond');
    mockApi({ [JOINTS]: [], [PUT]: saveHandler() });
    renderEditor();
    expect(screen.queryByTestId('restored-note')).toBeNull();
    expect(distantField()).toHaveValue(draftRound.distantParts);
    await pass(1800);
    expect(saves).toHaveLength(0);
    // Still kept for its own person.
    expect(roundDraftsFor('u-a').read('r-1')?.values.distantParts).toBe('Typed before the session ran out');
  });

  it('is restored and sent at the next sign-in of the same person', async () => {
    keepDraftOf('u-a');
    session('u-a', 'Tobin Maelor');
    mockApi({ [JOINTS]: [], [PUT]: saveHandler() });
    renderEditor();
    expect(await screen.findByTestId('restored-note')).toBeInTheDocument();
    await pass(200);
    await waitFor(() => expect(saves).toHaveLength(1));
    expect(saves[0]).toMatchObject({ distantParts: 'Typed before the session ran out' });
  });
});
