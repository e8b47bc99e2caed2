import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { TriggerRuleForm } from '@/features/trigger-rules/components/trigger-rule-form';
import { saveSession } from '@/lib/session';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

function renderForm() {
  const onSaved = jest.fn();
  renderWithProviders(<TriggerRuleForm projectId="p-1" onSaved={onSaved} onCancel={jest.fn()} />);
  return onSaved;
}

describe('TriggerRuleForm', () => {
  it('asks for a comparison and threshold, a distance, or nothing, as the watched quantity needs', async () => {
    mockApi({});
    const user = userEvent.setup();
    renderForm();
    const watch = screen.getByLabelText(/^Watches/);

    expect(screen.getByLabelText(/^Fires when the value is/)).toBeInTheDocument();
    expect(screen.getByLabelText(/^Threshold/)).toBeInTheDocument();

    await user.selectOptions(watch, 'crown-crossing-within');
    expect(screen.queryByLabelText(/^Fires when the value is/)).not.toBeInTheDocument();
    expect(screen.getByLabelText(/^Within this distance ahead of the face/)).toBeInTheDocument();

    await user.selectOptions(watch, 'support-class-change');
    expect(screen.queryByLabelText(/^Threshold/)).not.toBeInTheDocument();
    expect(screen.queryByLabelText(/^Within this distance/)).not.toBeInTheDocument();
    expect(
      screen.getByText('This is a yes/no condition: the rule fires whenever it is true.'),
    ).toBeInTheDocument();

    await user.selectOptions(watch, 'overbreak');
    expect(screen.getByText('m³')).toBeInTheDocument();
  });

  it('checks the threshold against the range of what is watched', async () => {
    const api = mockApi({});
    const user = userEvent.setup();
    renderForm();
    await user.type(screen.getByLabelText(/^Threshold/), '2000');
    await user.click(screen.getByRole('button', { name: 'Add rule' }));
    expect(await screen.findByText('Q runs from 0.001 to 1000.')).toBeInTheDocument();
    expect(screen.getByText('Say what is to be done when the rule fires.')).toBeInTheDocument();

    await user.selectOptions(screen.getByLabelText(/^Watches/), 'rmr89');
    await user.click(screen.getByRole('button', { name: 'Add rule' }));
    expect(await screen.findByText('RMR89 runs from 0 to 100.')).toBeInTheDocument();
    expect(api).not.toHaveBeenCalled();
  });

  it('sends a yes/no rule without comparison or threshold, and shows the server field errors', async () => {
    const bodies: unknown[] = [];
    mockApi({
      'POST /api/projects/p-1/trigger-rules': async (request) => {
        bodies.push(await request.json());
        return jsonResponse(
          {
            code: 'VALIDATION_FAILED',
            message: 'Check the action.',
            fields: { action: 'Say what is to be done.' },
          },
          400,
        );
      },
    });
    const user = userEvent.setup();
    renderForm();
    await user.type(screen.getByLabelText(/^Threshold/), '0.5');
    await user.selectOptions(screen.getByLabelText(/^Watches/), 'open-red-hazard');
    await user.click(screen.getByRole('radio', { name: 'Red' }));
    await user.type(screen.getByLabelText(/^Action to take/), 'Stop and call the shift engineer.');
    await user.click(screen.getByRole('button', { name: 'Add rule' }));
    expect(await screen.findByText('Say what is to be done.')).toBeInTheDocument();
    await waitFor(() => expect(bodies).toHaveLength(1));
    expect(bodies[0]).toMatchObject({
      watch: 'open-red-hazard',
      comparison: null,
      threshold: null,
      level: 'red',
    });
  });

  describe('a rule that fires on a change from the last round (issue 11 item 3)', () => {
    it('asks for a fall or a rise and its size, says the rule in words, and sends a fall as a negative change', async () => {
      const bodies: unknown[] = [];
      const onSaved = jest.fn();
      mockApi({
        'POST /api/projects/p-1/trigger-rules': async (request) => {
          const body = (await request.json()) as Record<string, unknown>;
          bodies.push(body);
          return jsonResponse({ id: 'tr-1', ...body, enabled: true, summary: '', version: 1 }, 201);
        },
      });
      const user = userEvent.setup();
      renderWithProviders(<TriggerRuleForm projectId="p-1" onSaved={onSaved} onCancel={jest.fn()} />);
      // On the value by default, as every rule before.
      expect(screen.getByRole('radio', { name: 'On this round’s value' })).toBeChecked();
      await user.click(screen.getByRole('radio', { name: /^On a change from the last round/ }));
      expect(screen.queryByLabelText(/^Fires when the value is/)).not.toBeInTheDocument();
      const on = screen.getByLabelText(/^Fires on/);
      expect(
        within(on)
          .getAllByRole('option')
          .map((o) => o.textContent),
      ).toEqual(['a fall of more than', 'a fall of at least', 'a rise of more than', 'a rise of at least']);
      expect(screen.getByText(/Q is compared by ratio/)).toBeInTheDocument();
      expect(screen.getByText('%')).toBeInTheDocument();

      // A fall of Q by 100 % or more cannot happen (Q stays above 0): refused before sending.
      await user.type(screen.getByLabelText(/^Size of the change/), '100');
      await user.type(screen.getByLabelText(/^Action to take/), 'Ask the engineer to look at the fall.');
      await user.click(screen.getByRole('button', { name: 'Add rule' }));
      expect(
        await screen.findByText('Q cannot fall by 100 % or more: give a fall between 0 and 99 %.'),
      ).toBeInTheDocument();
      expect(bodies).toHaveLength(0);

      await user.clear(screen.getByLabelText(/^Size of the change/));
      await user.type(screen.getByLabelText(/^Size of the change/), '50');
      expect(screen.getByTestId('trigger-rule-in-words')).toHaveTextContent(
        'In words: Q falls by more than 50 % from the last round → amber',
      );
      await user.click(screen.getByRole('button', { name: 'Add rule' }));
      await waitFor(() => expect(bodies).toHaveLength(1));
      expect(bodies[0]).toMatchObject({ watch: 'q', fires: 'change', comparison: '<', threshold: -50 });

      // A rise is sent as it is typed.
      await user.selectOptions(screen.getByLabelText(/^Watches/), 'inflow-per-10m');
      await user.selectOptions(screen.getByLabelText(/^Fires on/), '>=');
      expect(
        screen.getByText(/this round’s value less the last round’s, in l\/min per 10 m/),
      ).toBeInTheDocument();
      await user.clear(screen.getByLabelText(/^Size of the change/));
      await user.type(screen.getByLabelText(/^Size of the change/), '20');
      expect(screen.getByTestId('trigger-rule-in-words')).toHaveTextContent(
        'Water inflow per 10 m rises by 20 l/min per 10 m or more from the last round',
      );
    });

    it('offers the choice only where a change means something, and says when a yes/no condition fires', async () => {
      const bodies: unknown[] = [];
      mockApi({
        'POST /api/projects/p-1/trigger-rules': async (request) => {
          bodies.push(await request.json());
          return jsonResponse({ code: 'VALIDATION_FAILED', message: 'No.', fields: {} }, 400);
        },
      });
      const user = userEvent.setup();
      renderForm();
      const watch = screen.getByLabelText(/^Watches/);
      await user.selectOptions(watch, 'adverse-orientation');
      await user.click(screen.getByRole('radio', { name: /^On a change from the last round/ }));
      expect(screen.getByText(/fires only when it newly appears/)).toBeInTheDocument();
      expect(screen.getByTestId('trigger-rule-in-words')).toHaveTextContent(
        'A set or feature adverse to the drive, newly (not on the last round) → amber',
      );
      // The class-change rule already compares with the last round, and the crown reach reads this face.
      await user.selectOptions(watch, 'support-class-change');
      expect(screen.queryByRole('radio', { name: /^On a change/ })).not.toBeInTheDocument();
      await user.selectOptions(watch, 'crown-crossing-within');
      expect(screen.queryByRole('radio', { name: /^On a change/ })).not.toBeInTheDocument();
      await user.selectOptions(watch, 'support-class-change');
      await user.type(screen.getByLabelText(/^Action to take/), 'Tell the engineer.');
      await user.click(screen.getByRole('button', { name: 'Add rule' }));
      await waitFor(() => expect(bodies).toHaveLength(1));
      expect(bodies[0]).toMatchObject({ watch: 'support-class-change', fires: 'value' });
    });

    it('shows a stored fall as its size, with “a fall of at least” for ≤', () => {
      mockApi({});
      renderWithProviders(
        <TriggerRuleForm
          projectId="p-1"
          rule={{
            id: 'tr-1',
            watch: 'rmr89',
            fires: 'change',
            comparison: '<=',
            threshold: -10,
            level: 'red',
            action: 'Stop and call the designer.',
            ownerRole: 'engineer',
            timeAllowedHours: 1,
            enabled: true,
            summary: 'RMR89 falls by 10 points or more from the last round → red',
            version: 3,
          }}
          onSaved={jest.fn()}
          onCancel={jest.fn()}
        />,
      );
      expect(screen.getByLabelText(/^Size of the change/)).toHaveValue('10');
      expect(screen.getByLabelText(/^Fires on/)).toHaveValue('<=');
      expect(screen.getByTestId('trigger-rule-in-words')).toHaveTextContent(
        'RMR89 falls by 10 points or more from the last round → red',
      );
    });
  });

  describe('trying the rule on recent rounds', () => {
    // Invented rounds of an invented heading.
    const headings = [
      {
        id: 'h-1',
        projectId: 'p-1',
        code: 'KT-N',
        name: 'Northern drive',
        startChainage: 1250,
        chainageStyle: 'km+m',
        chainageDecimals: 1,
        driveTrend: 47,
        gradientPercent: 0.4,
        profileShape: 'horseshoe',
        profileWidth: 6.2,
        profileHeight: 6.4,
        axisHeight: 3.2,
        stages: ['full-face'],
        plannedRoundLength: 3,
        startEasting: null,
        startNorthing: null,
        startElevation: null,
        version: 1,
      },
    ];
    const match = (n: number, chainage: number, q: number) => ({
      roundId: `r-${n}`,
      headingCode: 'KT-N',
      roundNumber: n,
      stage: 'full-face',
      faceChainage: chainage,
      shiftDate: `2026-11-${String(10 + n).padStart(2, '0')}`,
      value: q,
      detail: `Q ${q} < 0.5`,
    });

    async function fillRedQRule(user: ReturnType<typeof userEvent.setup>) {
      await user.type(screen.getByLabelText(/^Threshold/), '0.5');
      await user.click(screen.getByRole('radio', { name: 'Red' }));
      await user.type(screen.getByLabelText(/^Action to take/), 'Stop and call the shift engineer.');
    }

    it('shows how many rounds were checked and where the rule would have fired, without saving', async () => {
      const bodies: unknown[] = [];
      const api = mockApi({
        'GET /api/projects/p-1/headings': headings,
        'POST /api/projects/p-1/trigger-rules/preview': async (request) => {
          bodies.push(await request.json());
          return jsonResponse({
            evaluatedRounds: 31,
            matches: [match(18, 2513, 0.247), match(17, 2509.55, 0.289)],
            notEvaluated: null,
          });
        },
      });
      const user = userEvent.setup();
      const onSaved = renderForm();
      await fillRedQRule(user);
      await user.click(screen.getByRole('button', { name: 'Try on recent rounds' }));

      const result = await screen.findByRole('region', { name: 'Tried on recent rounds' });
      expect(bodies).toEqual([
        expect.objectContaining({ watch: 'q', comparison: '<', threshold: 0.5, level: 'red' }),
      ]);
      expect(within(result).getByTestId('trigger-preview-summary')).toHaveTextContent(
        'Would have fired on 2 rounds of 31.',
      );
      expect(result).toHaveTextContent('Checked 31 rounds');
      const table = within(result).getByRole('table', { name: 'Rounds where the rule would have fired' });
      const rows = within(table).getAllByRole('row').slice(1);
      expect(rows).toHaveLength(2);
      expect(rows[0]).toHaveTextContent('KT-N');
      expect(rows[0]).toHaveTextContent('#18 · Full face');
      expect(rows[0]).toHaveTextContent('2+513.0');
      expect(rows[0]).toHaveTextContent('2026-11-28');
      expect(rows[0]).toHaveTextContent('Q 0.247 < 0.5');
      await waitFor(() => expect(rows[1]).toHaveTextContent('2+509.6'));

      // Nothing is saved by trying, and a changed threshold marks the result as out of date.
      expect(requestedRoutes(api)).not.toContain('POST /api/projects/p-1/trigger-rules');
      expect(onSaved).not.toHaveBeenCalled();
      expect(within(result).queryByText(/has changed since this try/)).not.toBeInTheDocument();
      await user.type(screen.getByLabelText(/^Threshold/), '5');
      expect(within(result).getByText(/has changed since this try/)).toBeInTheDocument();
    });

    it('says when the rule would not have fired, or why it cannot be tried', async () => {
      let answer: object = { evaluatedRounds: 45, matches: [], notEvaluated: null };
      mockApi({
        'GET /api/projects/p-1/headings': headings,
        'POST /api/projects/p-1/trigger-rules/preview': () => jsonResponse(answer),
      });
      const user = userEvent.setup();
      renderForm();
      await fillRedQRule(user);
      await user.click(screen.getByRole('button', { name: 'Try on recent rounds' }));
      const result = await screen.findByRole('region', { name: 'Tried on recent rounds' });
      expect(result).toHaveTextContent('Would not have fired');
      expect(result).toHaveTextContent('Checked 45 rounds');
      expect(within(result).queryByRole('table')).not.toBeInTheDocument();

      // One empty draft among 30 rounds: the outcome on the 29 shows, with the note beside it.
      answer = {
        evaluatedRounds: 29,
        matches: [],
        notEvaluated: '1 of the 30 latest rounds lack what this rule reads, so it was not evaluated on them.',
      };
      await user.click(screen.getByRole('button', { name: 'Try on recent rounds' }));
      await waitFor(() =>
        expect(screen.getByRole('region', { name: 'Tried on recent rounds' })).toHaveTextContent(
          'Would not have fired',
        ),
      );
      const partly = screen.getByRole('region', { name: 'Tried on recent rounds' });
      expect(partly).toHaveTextContent('Checked 29 rounds');
      expect(partly).toHaveTextContent('Not tried on every round');
      expect(partly).toHaveTextContent('1 of the 30 latest rounds lack what this rule reads');
      expect(partly).not.toHaveTextContent('Cannot be tried yet');

      answer = {
        evaluatedRounds: 0,
        matches: [],
        notEvaluated: 'Hazards are not recorded yet, so this rule has nothing to check.',
      };
      await user.selectOptions(screen.getByLabelText(/^Watches/), 'open-red-hazard');
      await user.click(screen.getByRole('button', { name: 'Try on recent rounds' }));
      await waitFor(() =>
        expect(screen.getByRole('region', { name: 'Tried on recent rounds' })).toHaveTextContent(
          'Hazards are not recorded yet, so this rule has nothing to check.',
        ),
      );
      expect(screen.getByRole('region', { name: 'Tried on recent rounds' })).toHaveTextContent(
        'Cannot be tried yet',
      );
    });

    it('asks for the missing parts of the rule before trying it', async () => {
      const api = mockApi({});
      const user = userEvent.setup();
      renderForm();
      await user.click(screen.getByRole('button', { name: 'Try on recent rounds' }));
      expect(
        await screen.findByText('Complete the rule first: see the messages under the fields.'),
      ).toBeInTheDocument();
      expect(screen.getByText('Give the threshold.')).toBeInTheDocument();
      expect(screen.getByText('Say what is to be done when the rule fires.')).toBeInTheDocument();
      expect(api).not.toHaveBeenCalled();
      expect(screen.queryByRole('region', { name: 'Tried on recent rounds' })).not.toBeInTheDocument();
    });
  });
});
