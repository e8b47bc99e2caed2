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
