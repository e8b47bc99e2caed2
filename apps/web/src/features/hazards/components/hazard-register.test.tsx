import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { HazardRegister } from './hazard-register';
import type { Hazard, Heading } from '@/api/contract';
import { saveSession } from '@/lib/session';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

const BASE = '/api/projects/p-1/headings/h-1/hazards';

const heading = {
  id: 'h-1',
  projectId: 'p-1',
  code: 'HR-U',
  name: 'Invented upstream drive',
  chainageStyle: 'km+m',
  chainageDecimals: 1,
  startChainage: 1000,
  chainageSense: 'increasing',
  driveTrend: 47,
  gradientPercent: 0.4,
  profileShape: 'horseshoe',
  profileWidth: 6.2,
  profileHeight: 6.4,
  axisHeight: 3.2,
  plannedRoundLength: 3,
  stages: ['full-face'],
  startEasting: null,
  startNorthing: null,
  startElevation: null,
  version: 1,
} as unknown as Heading;

const hazard = (over: Partial<Hazard>): Hazard => ({
  id: 'hz-1',
  headingId: 'h-1',
  kind: 'wedge',
  fromChainage: 1040,
  toChainage: 1043,
  level: 'red',
  description: 'Wedge of S1 and S3 in the crown.',
  origin: 'round',
  roundId: 'r-12',
  roundNumber: 12,
  handoverId: null,
  photoIds: ['ph-1'],
  status: 'open',
  raisedBy: 'u-1',
  raisedByName: 'Invented Geologist',
  raisedAt: '2026-12-01T06:10:00.000Z',
  closedBy: null,
  closedByName: null,
  closedAt: null,
  closeReason: null,
  version: 1,
  ...over,
});

const register = [
  hazard({}),
  hazard({
    id: 'hz-2',
    kind: 'water',
    level: 'amber',
    fromChainage: 1020,
    toChainage: 1020,
    origin: 'direct',
    roundId: null,
    roundNumber: null,
    photoIds: [],
  }),
  hazard({
    id: 'hz-3',
    kind: 'misfire',
    level: 'red',
    status: 'closed',
    closedBy: 'u-2',
    closedByName: 'Invented Supervisor',
    closedAt: '2026-12-01T09:00:00.000Z',
    closeReason: 'Holes washed out by the shot firer.',
  }),
];

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

describe('HazardRegister', () => {
  it('lists open hazards first with level as colour, mark and word, then closed ones with who closed them and why', async () => {
    mockApi({ [`GET ${BASE}`]: register });
    renderWithProviders(
      <HazardRegister projectId="p-1" heading={heading} role="viewer" timeZone="Asia/Kathmandu" />,
    );
    const open = await screen.findByRole('list', { name: 'Open hazards' });
    const items = within(open).getAllByRole('listitem');
    expect(items).toHaveLength(2);
    // One date style, in the project's time zone (issue 19, item 7): 06:10 UTC is 11:55 in Kathmandu.
    expect(items[0]).toHaveTextContent('1 Dec 2026, 11:55');
    expect(items[0]).toHaveTextContent('Wedge');
    expect(items[0]).toHaveTextContent('1+040.0 – 1+043.0');
    expect(items[0]).toHaveTextContent('Raised on round 12 by Invented Geologist');
    expect(items[0]).toHaveTextContent('1 photo');
    expect(within(items[0]).getByText('Red')).toHaveAttribute('data-level', 'red');
    expect(within(items[1]).getByText('Amber')).toHaveAttribute('data-level', 'amber');
    expect(items[1]).toHaveTextContent('at 1+020.0');
    const closed = screen.getByRole('list', { name: 'Closed hazards' });
    expect(closed).toHaveTextContent('Closed by Invented Supervisor');
    expect(closed).toHaveTextContent('Holes washed out by the shot firer.');
    // A viewer reads only.
    expect(screen.queryByRole('button', { name: 'Raise hazard' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Close…' })).toBeNull();
  });

  it('lets an engineer close a hazard only with a reason, and reads the register again', async () => {
    let closedBody: unknown = null;
    const mock = mockApi({
      [`GET ${BASE}`]: () =>
        jsonResponse(
          closedBody === null
            ? register
            : register.map((h) => (h.id === 'hz-1' ? { ...h, status: 'closed' } : h)),
        ),
      [`POST ${BASE}/hz-1/close`]: async (request: Request) => {
        closedBody = await request.json();
        return jsonResponse(hazard({ status: 'closed', closeReason: 'Scaled and bolted.', version: 2 }));
      },
    });
    const user = userEvent.setup();
    renderWithProviders(<HazardRegister projectId="p-1" heading={heading} role="engineer" />);
    const open = await screen.findByRole('list', { name: 'Open hazards' });
    const closeButtons = within(open).getAllByRole('button', { name: 'Close…' });
    expect(closeButtons).toHaveLength(2);
    await user.click(closeButtons[0]);
    const dialog = await screen.findByRole('dialog', { name: 'Close hazard' });
    await user.click(within(dialog).getByRole('button', { name: 'Close hazard' }));
    expect(within(dialog).getByText('Give the reason (at least 3 characters).')).toBeInTheDocument();
    expect(requestedRoutes(mock)).not.toContain(`POST ${BASE}/hz-1/close`);
    await user.type(within(dialog).getByRole('textbox'), '  Scaled and bolted.  ');
    await user.click(within(dialog).getByRole('button', { name: 'Close hazard' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(closedBody).toEqual({ reason: 'Scaled and bolted.', version: 1 });
    await waitFor(() =>
      expect(
        within(screen.getByRole('list', { name: 'Open hazards' })).getAllByRole('listitem'),
      ).toHaveLength(1),
    );
  });

  it('shows no Close to a geologist, who raises a hazard through the form (checked here, then by the server)', async () => {
    const sent: unknown[] = [];
    mockApi({
      [`GET ${BASE}`]: register,
      [`POST ${BASE}`]: async (request: Request) => {
        const body = (await request.json()) as Record<string, unknown>;
        sent.push(body);
        if (sent.length === 1)
          return jsonResponse(
            {
              code: 'VALIDATION_FAILED',
              message: 'Chainage 0+990.0 is behind the start of heading HR-U (1+000.0).',
              fields: { fromChainage: 'Chainage 0+990.0 is behind the start of heading HR-U (1+000.0).' },
            },
            400,
          );
        return jsonResponse(hazard({ id: String(body.id), kind: 'gas', level: 'amber' }), 201);
      },
    });
    const user = userEvent.setup();
    renderWithProviders(
      <HazardRegister projectId="p-1" heading={heading} role="geologist" faceChainage={1043} />,
    );
    await screen.findByRole('list', { name: 'Open hazards' });
    expect(screen.queryByRole('button', { name: 'Close…' })).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Raise hazard' }));
    const form = await screen.findByRole('form', { name: 'Raise hazard' });
    // The range starts at the face; the rest must be given.
    expect(within(form).getByLabelText(/From chainage/)).toHaveValue('1043');
    await user.click(within(form).getByRole('button', { name: 'Raise hazard' }));
    expect(await within(form).findByText('Choose the kind of hazard.')).toBeInTheDocument();
    expect(within(form).getByText('Choose the level.')).toBeInTheDocument();
    expect(sent).toHaveLength(0);

    await user.selectOptions(within(form).getByLabelText(/Kind/), 'gas');
    await user.click(within(form).getByRole('radio', { name: 'amber' }));
    await user.clear(within(form).getByLabelText(/From chainage/));
    await user.type(within(form).getByLabelText(/From chainage/), '990');
    await user.type(within(form).getByLabelText(/What and where/), 'Methane reading 0.4 % at the face.');
    await user.click(within(form).getByRole('button', { name: 'Raise hazard' }));
    expect(
      await within(form).findByText('Chainage 0+990.0 is behind the start of heading HR-U (1+000.0).'),
    ).toBeInTheDocument();

    await user.clear(within(form).getByLabelText(/From chainage/));
    await user.type(within(form).getByLabelText(/From chainage/), '1041,5');
    await user.click(within(form).getByRole('button', { name: 'Raise hazard' }));
    await waitFor(() => expect(screen.queryByRole('form', { name: 'Raise hazard' })).toBeNull());
    expect(sent[1]).toEqual({
      id: (sent[0] as Record<string, unknown>).id, // the same client id on the retry
      kind: 'gas',
      level: 'amber',
      fromChainage: 1041.5,
      toChainage: 1043,
      description: 'Methane reading 0.4 % at the face.',
    });
    expect(await screen.findByRole('status')).toHaveTextContent('Gas raised on HR-U');
  });
});
