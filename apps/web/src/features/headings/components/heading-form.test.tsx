import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Heading } from '@/api/contract';
import { HeadingForm } from '@/features/headings/components/heading-form';
import { saveSession } from '@/lib/session';
import { findDialog } from '@/testing/dialogs';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

// Invented heading of an invented project.
const heading: Heading = {
  id: 'h-9',
  projectId: 'p-1',
  code: 'KT-N',
  name: 'Northern drive from the Kessel adit',
  startChainage: 1250,
  chainageStyle: 'km+m',
  chainageDecimals: 1,
  driveTrend: 47,
  gradientPercent: 0.4,
  profileShape: 'horseshoe',
  profileWidth: 6.2,
  profileHeight: 6.4,
  axisHeight: 3.2,
  stages: ['top-heading', 'bench'],
  plannedRoundLength: 3,
  startEasting: null,
  startNorthing: null,
  startElevation: null,
  version: 4,
};

function renderForm(props: Partial<Parameters<typeof HeadingForm>[0]> = {}) {
  const onSaved = jest.fn();
  renderWithProviders(
    <HeadingForm
      projectId="p-1"
      coordinateGrid="Kessel site grid"
      onSaved={onSaved}
      onCancel={jest.fn()}
      {...props}
    />,
  );
  return onSaved;
}

async function fillValidHeading(user: ReturnType<typeof userEvent.setup>) {
  await user.type(screen.getByLabelText(/^Code/), 'KT-S');
  await user.type(screen.getByRole('textbox', { name: /^Name/ }), 'Southern drive');
  await user.type(screen.getByLabelText(/^Start chainage/), '0+980.0');
  await user.type(screen.getByLabelText(/^Drive direction/), '227');
  await user.clear(screen.getByLabelText(/^Gradient \(/));
  await user.type(screen.getByLabelText(/^Gradient \(/), '-0.4');
  await user.type(screen.getByRole('textbox', { name: /^Width/ }), '6.2');
  await user.type(screen.getByRole('textbox', { name: /^Height/ }), '6.4');
  await user.type(screen.getByLabelText(/^Axis above invert/), '3.2');
  await user.type(screen.getByLabelText(/^Planned round length/), '3');
}

describe('HeadingForm', () => {
  it('explains each missing or wrong value before anything is sent', async () => {
    const api = mockApi({});
    const user = userEvent.setup();
    renderForm();
    await user.type(screen.getByLabelText(/^Start chainage/), '1+25');
    await user.type(screen.getByLabelText(/^Drive direction/), '360');
    await user.type(screen.getByRole('textbox', { name: /^Width/ }), '6');
    await user.type(screen.getByRole('textbox', { name: /^Height/ }), '5');
    await user.type(screen.getByLabelText(/^Axis above invert/), '5.5');
    await user.click(screen.getByRole('checkbox', { name: 'Full face' }));
    await user.click(screen.getByRole('button', { name: 'Add heading' }));

    expect(await screen.findByText('Give the heading a code, e.g. HR-U.')).toBeInTheDocument();
    expect(
      screen.getByText('Write the chainage as kilometres + metres (1+250.0) or in metres (1250.0).'),
    ).toBeInTheDocument();
    expect(
      screen.getByText('Drive direction is an azimuth in degrees, 0 to less than 360.'),
    ).toBeInTheDocument();
    expect(screen.getByText('The axis (5.5 m) must lie within the height (5 m).')).toBeInTheDocument();
    expect(screen.getByText('Choose at least one stage.')).toBeInTheDocument();
    expect(screen.getByText('Give the planned round length in metres.')).toBeInTheDocument();
    expect(api).not.toHaveBeenCalled();
  });

  it('shows the gradient in both units and converts it when the unit is switched', async () => {
    mockApi({});
    const user = userEvent.setup();
    renderForm();
    const gradient = screen.getByLabelText(/^Gradient \(/);
    await user.clear(gradient);
    await user.type(gradient, '10');
    expect(screen.getByText('= 5.71°, in the direction of advance.')).toBeInTheDocument();
    await user.click(screen.getByRole('radio', { name: 'degrees' }));
    expect(gradient).toHaveValue('5.711');
    expect(screen.getByText('= 10 %, in the direction of advance.')).toBeInTheDocument();
  });

  it('sends the heading with the gradient in per cent and a parsed chainage', async () => {
    let sent: unknown;
    mockApi({
      'POST /api/projects/p-1/headings': async (request) => {
        sent = await request.json();
        return jsonResponse({ ...heading, id: 'h-new', code: 'KT-S' }, 201);
      },
    });
    const user = userEvent.setup();
    const onSaved = renderForm();
    await fillValidHeading(user);
    await user.click(screen.getByRole('button', { name: 'Add heading' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect(sent).toMatchObject({
      code: 'KT-S',
      startChainage: 980,
      gradientPercent: -0.4,
      profileShape: 'horseshoe',
      stages: ['full-face'],
      startEasting: null,
    });
  });

  it('puts a server error on the field it concerns', async () => {
    mockApi({
      'POST /api/projects/p-1/headings': () =>
        jsonResponse(
          {
            code: 'VALIDATION_FAILED',
            message: 'Check the gradient.',
            fields: {
              gradientPercent: 'Gradients steeper than 30 % are outside what Roundbook handles.',
              code: 'This code is already used by another heading.',
            },
          },
          400,
        ),
    });
    const user = userEvent.setup();
    renderForm();
    await fillValidHeading(user);
    await user.click(screen.getByRole('button', { name: 'Add heading' }));
    expect(await screen.findByText('This code is already used by another heading.')).toBeInTheDocument();
    expect(
      screen.getByText('Gradients steeper than 30 % are outside what Roundbook handles.'),
    ).toBeInTheDocument();
    expect(screen.getByLabelText(/^Gradient \(/)).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText(/^Code/)).toHaveAttribute('aria-invalid', 'true');
  });

  it('keeps the typing when someone else saved first, and loads their version only when asked', async () => {
    const theirs: Heading = { ...heading, name: 'Northern drive (renamed by the office)', version: 5 };
    const bodies: { version: number; name: string }[] = [];
    mockApi({
      'PATCH /api/projects/p-1/headings/h-9': async (request) => {
        const body = (await request.json()) as { version: number; name: string };
        bodies.push(body);
        if (body.version === 4) {
          return jsonResponse(
            {
              code: 'STALE_VERSION',
              message: 'Someone else changed this heading since you opened it.',
              details: { current: theirs },
            },
            409,
          );
        }
        return jsonResponse({ ...theirs, name: body.name, version: 6 });
      },
    });
    const user = userEvent.setup();
    const onSaved = renderForm({ heading });
    const name = screen.getByRole('textbox', { name: /^Name/ });
    await user.clear(name);
    await user.type(name, 'Northern drive, my wording');
    await user.click(screen.getByRole('button', { name: 'Save heading' }));

    const notice = await screen.findByTestId('stale-version-notice');
    expect(notice).toHaveTextContent('Someone else changed this heading since you opened it.');
    const row = within(notice).getByRole('row', { name: /Name/ });
    expect(row).toHaveTextContent('Northern drive, my wording');
    expect(row).toHaveTextContent('Northern drive (renamed by the office)');
    expect(name).toHaveValue('Northern drive, my wording');
    expect(onSaved).not.toHaveBeenCalled();

    await user.click(within(notice).getByRole('button', { name: 'Load their version' }));
    expect(name).toHaveValue('Northern drive (renamed by the office)');
    expect(screen.getByTestId('stale-version-notice')).toHaveTextContent('Northern drive, my wording');

    await user.clear(name);
    await user.type(name, 'Northern drive, agreed wording');
    await user.click(screen.getByRole('button', { name: 'Save heading' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect(bodies.map((b) => b.version)).toEqual([4, 5]);
  });

  describe('when rounds already exist on the heading', () => {
    const question = {
      code: 'NEEDS_CONFIRMATION',
      message:
        '23 round(s) are recorded on KT-N. Changing its drive direction changes how their joints are judged against the drive, which are worked out again from the new values. Confirm to apply.',
      details: { rounds: 23, fields: ['driveTrend'] },
    };

    function mockPatch(bodies: Record<string, unknown>[]) {
      return mockApi({
        'PATCH /api/projects/p-1/headings/h-9': async (request) => {
          const body = (await request.json()) as Record<string, unknown>;
          bodies.push(body);
          if (body.confirmRecompute !== true) return jsonResponse(question, 409);
          return jsonResponse({ ...heading, driveTrend: body.driveTrend, version: 5 });
        },
      });
    }

    // In jsdom, Fluent's focus manager marks an open dialog aria-hidden shortly after it opens (in a
    // browser it does not: the e2e test finds the dialog and its buttons by role), so the dialog is found
    // by its title (findDialog) and its buttons are looked up with `hidden: true`.
    async function changeDrive(user: ReturnType<typeof userEvent.setup>) {
      const drive = screen.getByLabelText(/^Drive direction/);
      await user.clear(drive);
      await user.type(drive, '52.5');
      await user.click(screen.getByRole('button', { name: 'Save heading' }));
      return drive;
    }

    it('asks first with the server’s words, and sends the change again once confirmed', async () => {
      const bodies: Record<string, unknown>[] = [];
      mockPatch(bodies);
      const user = userEvent.setup();
      const onSaved = renderForm({ heading });
      await changeDrive(user);

      const dialog = await findDialog('Change the drive direction of KT-N?');
      expect(dialog).toHaveTextContent(question.message);
      expect(within(dialog).getByTestId('recompute-rounds')).toHaveTextContent('23');
      expect(onSaved).not.toHaveBeenCalled();
      expect(bodies).toHaveLength(1);
      expect(bodies[0]).not.toHaveProperty('confirmRecompute');

      await user.click(within(dialog).getByRole('button', { name: 'Save and recompute', hidden: true }));
      await waitFor(() => expect(onSaved).toHaveBeenCalledWith(expect.objectContaining({ version: 5 })));
      expect(bodies).toHaveLength(2);
      expect(bodies[1]).toMatchObject({ driveTrend: 52.5, version: 4, confirmRecompute: true });
    }, 15_000);

    it('saves nothing when the person says no, and keeps their typing', async () => {
      const bodies: Record<string, unknown>[] = [];
      mockPatch(bodies);
      const user = userEvent.setup();
      const onSaved = renderForm({ heading });
      const drive = await changeDrive(user);

      const dialog = await findDialog('Change the drive direction of KT-N?');
      await user.click(within(dialog).getByRole('button', { name: "Don't save", hidden: true }));
      await waitFor(() =>
        expect(screen.queryByRole('alertdialog', { hidden: true })).not.toBeInTheDocument(),
      );

      expect(screen.getByTestId('recompute-declined')).toHaveTextContent('Nothing was saved');
      expect(drive).toHaveValue('52.5');
      expect(bodies).toHaveLength(1);
      expect(onSaved).not.toHaveBeenCalled();
    }, 15_000);
  });
});
