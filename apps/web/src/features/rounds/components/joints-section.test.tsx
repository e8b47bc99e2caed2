// The Joints section's compact rows (issue 19 item 4), removing a joint with Undo (item 8) and the "same
// feature as" picker (issue 10 item 2), through the round editor with the API mocked.
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

beforeEach(() => jest.useFakeTimers());
afterEach(() => {
  jest.clearAllTimers();
  jest.useRealTimers();
  restoreFetch();
});
const setupUser = () => userEvent.setup({ advanceTimers: jest.advanceTimersByTime });
const pass = (ms: number) => act(() => jest.advanceTimersByTimeAsync(ms));

const PUT = 'PUT /api/projects/p-1/rounds/r-1';
const JOINTS = 'GET /api/projects/p-1/headings/h-1/joints';

const joint = (id: string, text: string, extra: Partial<Round['joints'][number]> = {}) => ({
  id,
  kind: 'joint' as const,
  notation: 'dip-direction/dip' as const,
  orientationText: text,
  setLabel: null,
  setOverride: false,
  spacingM: 0.4,
  persistenceM: 3,
  apertureMm: null,
  jr: 1.5,
  jrc: null,
  jrcMethod: null,
  ja: 2,
  water: 'damp' as const,
  thicknessM: null,
  dipDirection: null,
  dip: null,
  orientationError: null,
  seq: 1,
  infill: '',
  notes: '',
  sameAsJointId: null,
  ...extra,
});
const FAULT_ID = '44444444-4444-4444-8444-444444444444';
const round: Round = {
  ...draftRound,
  setParameters: { windowM: 0, count: null },
  joints: [
    joint('11111111-1111-4111-8111-111111111111', '137/70'),
    joint(FAULT_ID, '240/22', { kind: 'fault', thicknessM: 0.3, spacingM: null }),
    joint('22222222-2222-4222-8222-222222222222', '020/30'),
  ],
};
const earlier = (
  id: string,
  roundNumber: number,
  faceChainage: number,
  dd: number,
  dip: number,
  extra = {},
) => ({
  id,
  roundId: `r-${roundNumber}`,
  roundNumber,
  faceChainage,
  kind: 'fault',
  dipDirection: dd,
  dip,
  setLabel: null,
  sameAsJointId: null,
  notes: '',
  ...extra,
});
// Round 40's fault (first seen there), round 41's observation linked to it, a steep joint (not offered:
// far off in orientation) and a fault 60 m back (not offered: too far).
const nearby = [
  earlier('f-40', 40, 1247.5, 238, 20, { notes: 'Invented: the clay fault of the left wall' }),
  earlier('f-41', 41, 1250.5, 241, 21, { sameAsJointId: 'f-40' }),
  earlier('j-41', 41, 1250.5, 135, 69, { kind: 'joint' }),
  earlier('f-20', 20, 1193.5, 240, 22),
];

const saves: SaveRoundRequest[] = [];
const saveHandler = async (request: Request) => {
  const body = (await request.json()) as SaveRoundRequest;
  saves.push(body);
  return jsonResponse({
    ...round,
    ...body,
    joints: body.joints.map((j, i) => ({
      ...j,
      id: j.id!,
      seq: i + 1,
      dipDirection: null,
      dip: null,
      orientationError: null,
    })),
    version: body.version + 1,
  });
};

function renderJoints() {
  saves.length = 0;
  mockApi({ [JOINTS]: nearby, [PUT]: saveHandler, 'GET /api/projects/p-1/trigger-rules': [] });
  renderWithProviders(
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

describe('Joints section: one line per joint', () => {
  it('shows the essentials in the row and the rest only under More, with every field kept', async () => {
    renderJoints();
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    const rows = screen.getAllByTestId('joint-row');
    expect(rows).toHaveLength(3);
    const first = within(rows[0]);
    for (const name of [
      'Kind of joint 1',
      'Orientation of joint 1',
      'Set of joint 1',
      'Spacing of joint 1, m',
      'Jr of joint 1',
      'Ja of joint 1',
    ])
      expect(first.getByLabelText(name)).toBeInTheDocument();
    // Folded away, but said in short words in the row.
    expect(first.queryByLabelText('Water of joint 1')).toBeNull();
    expect(rows[0]).toHaveTextContent('3 m long · damp');
    expect(first.getByTestId('orientation-feedback')).toHaveTextContent('137/70');

    const more = first.getByRole('button', { name: 'More of joint 1' });
    expect(more).toHaveAttribute('aria-expanded', 'false');
    await user.click(more);
    expect(more).toHaveAttribute('aria-expanded', 'true');
    for (const name of [
      'Persistence of joint 1, m',
      'Aperture of joint 1, mm',
      'Water of joint 1',
      'JRC of joint 1',
      'JRC method of joint 1',
      'Infill of joint 1',
      'Notes of joint 1',
      'Same feature as, joint 1',
    ])
      expect(first.getByLabelText(name)).toBeInTheDocument();
    expect(first.getByLabelText('Water of joint 1')).toHaveValue('damp');
    // Keyboard: Enter in a row's field goes to the next joint's orientation.
    await user.type(first.getByLabelText('Spacing of joint 1, m'), '{Enter}');
    expect(screen.getByLabelText('Orientation of joint 2')).toHaveFocus();
  });
});

describe('Joints section: removing a joint', () => {
  it('removes at once with a separate target and brings the joint back, in its place, with Undo', async () => {
    renderJoints();
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    const remove = screen.getByRole('button', { name: 'Remove joint 2' });
    // Its own cell, not beside the kind dropdown.
    expect(remove.closest('[role="cell"]')).not.toContainElement(screen.getByLabelText('Kind of joint 2'));
    await user.click(remove);
    expect(screen.getAllByTestId('joint-row')).toHaveLength(2);
    expect(screen.getByTestId('joint-removed')).toHaveTextContent('Joint 2 (fault 240/22) removed.');
    await user.click(within(screen.getByTestId('joint-removed')).getByRole('button', { name: 'Undo' }));
    expect(screen.getAllByTestId('joint-row')).toHaveLength(3);
    expect(screen.getByLabelText('Orientation of joint 2')).toHaveValue('240/22');
    expect(screen.getByLabelText('Kind of joint 2')).toHaveValue('fault');
    expect(screen.queryByTestId('joint-removed')).toBeNull();
    // Undone before the autosave pause ended: the round is as saved, and no save went without the joint.
    await pass(2000);
    expect(screen.getByTestId('save-state')).toHaveTextContent('Saved');
    expect(saves.filter((b) => !b.joints.some((j) => j.id === FAULT_ID))).toEqual([]);
  });
});

describe('Joints section: same feature as', () => {
  it('offers the earlier faults near this orientation and face, one per feature, and saves the first observation', async () => {
    renderJoints();
    const user = setupUser();
    await user.click(screen.getByRole('tab', { name: 'Joints' }));
    await user.click(screen.getByRole('button', { name: 'More of joint 2' }));
    const picker = screen.getByLabelText('Same feature as, joint 2');
    await waitFor(() => expect(within(picker).getAllByRole('option')).toHaveLength(2));
    const options = within(picker).getAllByRole('option');
    expect(options[0]).toHaveTextContent('Not linked');
    // The feature of rounds 40 and 41 once, by its latest observation (round 41), keyed by the first (f-40).
    expect(options[1]).toHaveTextContent(/^Round 41 at 1\+250\.5 · fault 241\/21 · 1° apart$/);
    expect(options[1]).toHaveAttribute('value', 'f-40');
    expect(screen.getByText(/within 30 m and 20° of this orientation/)).toBeInTheDocument();

    await user.selectOptions(picker, 'f-40');
    expect(screen.getAllByTestId('joint-row')[1]).toHaveTextContent('same feature as an earlier one');
    await pass(2000);
    await waitFor(() => expect(saves.length).toBeGreaterThan(0));
    expect(saves[saves.length - 1].joints[1].sameAsJointId).toBe('f-40');
    expect(saves[saves.length - 1].joints[0].sameAsJointId).toBeNull();
  });
});
