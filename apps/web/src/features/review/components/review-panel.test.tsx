import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ReviewPanel } from '@/features/review/components/review-panel';
import {
  CAUTION,
  classes,
  confirmedReview,
  returnedReview,
  submittedReview,
} from '@/features/review/testing/review-fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);

const REVIEW = 'GET /api/projects/p-1/rounds/r-1/review';
const panel = () =>
  renderWithProviders(<ReviewPanel projectId="p-1" roundId="r-1" supportClasses={classes} timeZone="UTC" />);

/** The bodies the mock received for a route. */
async function bodiesOf(api: jest.Mock, path: string): Promise<unknown[]> {
  const requests = api.mock.calls
    .map(([input]) => input as Request)
    .filter((r) => new URL(r.url).pathname === path);
  return Promise.all(requests.map((r) => r.clone().json() as Promise<unknown>));
}

describe('ReviewPanel', () => {
  it('confirms with the recommendation prefilled; another class asks for a reason; the password signs', async () => {
    const api = mockApi({
      [REVIEW]: submittedReview(),
      'POST /api/projects/p-1/rounds/r-1/confirm': () => jsonResponse(confirmedReview()),
    });
    panel();
    const user = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Confirm the round' });
    expect(screen.getByTestId('review-caution')).toHaveTextContent(CAUTION);
    const select = within(form).getByRole('combobox', { name: /Support class to build/ });
    expect(select).toHaveValue('c-B');
    expect(within(form).getByRole('textbox', { name: /Next round length/ })).toHaveValue('3');
    expect(within(form).queryByRole('textbox', { name: /Reason/ })).not.toBeInTheDocument();

    await user.selectOptions(select, 'c-C');
    await user.clear(within(form).getByRole('textbox', { name: /Next round length/ }));
    await user.type(within(form).getByRole('textbox', { name: /Next round length/ }), '2');
    await user.type(within(form).getByRole('textbox', { name: /Reason/ }), 'Crown joints open on the left');
    const sign = within(form).getByRole('button', { name: 'Sign and confirm' });
    expect(sign).toBeDisabled(); // no password yet
    await user.type(within(form).getByLabelText(/Your password/), 'my-own-password');
    await user.click(sign);

    await waitFor(() => expect(screen.getByTestId('confirmation')).toHaveTextContent('Class to buildC'));
    expect(screen.getByTestId('confirmation')).toHaveTextContent(
      'Edda Ravenshaw (engineer), 30 Nov 2026, 11:15',
    );
    expect(await bodiesOf(api, '/api/projects/p-1/rounds/r-1/confirm')).toEqual([
      {
        version: 7,
        classId: 'c-C',
        roundLength: 2,
        reason: 'Crown joints open on the left',
        comments: '',
        password: 'my-own-password',
      },
    ]);
  });

  it('shows a refused sign-off beside the password, and a round over the class maximum asks a reason', async () => {
    mockApi({
      [REVIEW]: submittedReview(),
      'POST /api/projects/p-1/rounds/r-1/confirm': () =>
        jsonResponse(
          {
            code: 'FORBIDDEN',
            message: 'That password is not right: the confirmation was not signed.',
            fields: { password: 'Type your own Roundbook password to sign.' },
          },
          403,
        ),
    });
    panel();
    const user = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Confirm the round' });
    const length = within(form).getByRole('textbox', { name: /Next round length/ });
    await user.clear(length);
    await user.type(length, '3.5');
    expect(within(form).getByRole('textbox', { name: /Reason/ })).toBeInTheDocument();
    await user.type(within(form).getByRole('textbox', { name: /Reason/ }), 'Trial round agreed');
    await user.type(within(form).getByLabelText(/Your password/), 'wrong');
    await user.click(within(form).getByRole('button', { name: 'Sign and confirm' }));
    expect(await within(form).findByText('Type your own Roundbook password to sign.')).toBeInTheDocument();
    expect(within(form).getByText(/the confirmation was not signed/)).toBeInTheDocument();
  });

  it('returns with comments per section, sending only the sections written in', async () => {
    const api = mockApi({
      [REVIEW]: submittedReview(),
      'POST /api/projects/p-1/rounds/r-1/return': () => jsonResponse(returnedReview()),
    });
    panel();
    const user = userEvent.setup();
    await user.click(await screen.findByRole('tab', { name: 'Return with comments' }));
    const form = screen.getByRole('form', { name: 'Return the round' });
    const send = within(form).getByRole('button', { name: 'Return to the geologist' });
    expect(send).toBeDisabled();
    await user.type(within(form).getByRole('textbox', { name: 'Ground' }), 'Say where the water comes from.');
    await user.click(send);
    await waitFor(async () =>
      expect(await bodiesOf(api, '/api/projects/p-1/rounds/r-1/return')).toEqual([
        { version: 7, comments: [{ section: 'ground', text: 'Say where the water comes from.' }] },
      ]),
    );
  });

  it('shows what changed since the previous round, each change in a word, or why nothing is compared', async () => {
    mockApi({
      [REVIEW]: submittedReview({
        sincePrevious: {
          previousRoundId: 'r-0',
          previousRoundNumber: 11,
          previousRevision: 1,
          note: '',
          changes: [
            {
              aspect: 'class',
              label: 'Support class',
              before: 'A (confirmed)',
              after: 'B (recommended)',
              trend: 'changed',
              text: 'Support class A → B',
            },
            {
              aspect: 'q',
              label: 'Q',
              before: '4',
              after: '0.8',
              trend: 'worse',
              text: 'Q fell from 4 to 0.8',
            },
            {
              aspect: 'water',
              label: 'Inflow per 10 m',
              before: '5 l/min',
              after: '5 l/min',
              trend: 'same',
              text: 'Inflow per 10 m unchanged at 5 l/min',
            },
            {
              aspect: 'set',
              label: 'Set C',
              before: '—',
              after: '030/85',
              trend: 'new',
              text: 'New set C (030/85)',
            },
          ],
        },
      }),
    });
    panel();
    const since = await screen.findByTestId('since-previous');
    expect(within(since).getByRole('heading', { name: 'Since round 11' })).toBeInTheDocument();
    const rows = within(since).getAllByRole('row').slice(1);
    expect(rows.map((r) => r.textContent)).toEqual([
      'Support classA (confirmed)B (recommended)changed',
      'Q40.8worse',
      'Inflow per 10 m5 l/min5 l/minunchanged',
      'Set C—030/85new',
    ]);
  });

  it('says why nothing is compared on the first round of a stage', async () => {
    mockApi({
      [REVIEW]: submittedReview({
        sincePrevious: {
          previousRoundId: null,
          previousRoundNumber: null,
          previousRevision: null,
          note: 'This is the first round of the heading at this stage.',
          changes: [],
        },
      }),
    });
    panel();
    expect(await screen.findByTestId('since-previous')).toHaveTextContent(
      'This is the first round of the heading at this stage.',
    );
  });

  it('shows the geologist the return comments to work through, and no decision', async () => {
    mockApi({ [REVIEW]: returnedReview() });
    panel();
    const comment = await screen.findByTestId('return-comment');
    expect(comment).toHaveTextContent('Ground');
    expect(comment).toHaveTextContent('Say where the water comes from.');
    expect(within(comment).getByRole('button', { name: 'Resolve' })).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Confirm the round' })).not.toBeInTheDocument();
    expect(screen.queryByRole('tab', { name: 'Confirm' })).not.toBeInTheDocument();
    expect(screen.getByTestId('review-caution')).toHaveTextContent(CAUTION);
  });

  it('tells an engineer who mapped the round that another engineer confirms it, but lets them return it', async () => {
    mockApi({
      [REVIEW]: submittedReview({
        canConfirm: {
          allowed: false,
          reason: 'You mapped or submitted this round: another engineer confirms it.',
        },
      }),
    });
    panel();
    expect(await screen.findByText(/another engineer confirms it/)).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Confirm the round' })).not.toBeInTheDocument();
    expect(screen.getByRole('tab', { name: 'Return with comments' })).toBeInTheDocument();
  });

  it('lets the owner acknowledge a fired rule with what was done; overdue shows in words', async () => {
    const rule = {
      ruleId: 'rule-1',
      level: 'amber' as const,
      summary: 'Q < 1 → amber',
      detail: 'Q 0.62 is below 1.',
      action: 'Tell the engineer.',
      ownerRole: 'engineer',
      timeAllowedHours: 4,
      dueAt: '2026-11-30T12:00:00.000Z',
      minutesLeft: -30,
      overdue: true,
      acknowledgedAt: null,
      acknowledgement: null,
      canAcknowledge: true,
      canAccept: false,
    };
    const acknowledged = submittedReview({
      rules: [
        {
          ...rule,
          overdue: false,
          acknowledgedAt: '2026-11-30T12:30:00.000Z',
          canAcknowledge: false,
          acknowledgement: {
            actionTaken: 'Probe holes drilled',
            note: '',
            byName: 'Edda Ravenshaw',
            role: 'engineer',
            at: '2026-11-30T12:30:00.000Z',
          },
        },
      ],
    });
    const api = mockApi({
      [REVIEW]: submittedReview({ rules: [rule] }),
      'POST /api/projects/p-1/rounds/r-1/triggers/rule-1/acknowledge': () => jsonResponse(acknowledged),
    });
    panel();
    const user = userEvent.setup();
    const item = await screen.findByTestId('round-rule');
    expect(item).toHaveTextContent('Overdue by 30 min');
    await user.click(within(item).getByRole('button', { name: 'Acknowledge…' }));
    const form = within(item).getByRole('form', { name: 'Acknowledge: Q < 1 → amber' });
    await user.type(within(form).getByRole('textbox', { name: /What was done/ }), 'Probe holes drilled');
    await user.click(within(form).getByRole('button', { name: 'Acknowledge' }));
    await waitFor(() =>
      expect(screen.getByTestId('round-rule')).toHaveTextContent(
        'Acknowledged by Edda Ravenshaw (engineer), 30 Nov 2026, 12:30: Probe holes drilled',
      ),
    );
    expect(await bodiesOf(api, '/api/projects/p-1/rounds/r-1/triggers/rule-1/acknowledge')).toEqual([
      { actionTaken: 'Probe holes drilled', note: '' },
    ]);
  });

  it('compares any two revisions field by field', async () => {
    const revision = (n: number, event: string, water: string, id: string) => ({
      id,
      revision: n,
      event,
      status: event === 'confirm' ? 'confirmed' : 'submitted',
      createdBy: 'u-geo',
      createdAt: '2026-11-30T09:00:00.000Z',
      record: { faceChainage: 1003, ground: { waterDescription: water }, joints: [] },
      assessment: {},
      assessmentVersion: 'test',
    });
    mockApi({
      [REVIEW]: confirmedReview(),
      'GET /api/projects/p-1/rounds/r-1/revisions': [
        revision(1, 'submit', '', 'v-1'),
        revision(1, 'return', '', 'v-2'),
        revision(2, 'submit', 'Drips from the crown joint', 'v-3'),
      ],
    });
    panel();
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Compare revisions' }));
    const table = await screen.findByRole('table', { name: 'Fields that differ' });
    expect(
      within(table)
        .getAllByTestId('revision-change')
        .map((r) => r.textContent),
    ).toEqual(['ground › waterDescription—Drips from the crown joint']);
    await user.selectOptions(screen.getByRole('combobox', { name: 'From' }), 'v-3');
    expect(await screen.findByText('No field differs between these two.')).toBeInTheDocument();
  });

  it('separation of duties: the engineer who mapped the round is told why Confirm is not offered, and may return it', async () => {
    const reason =
      'You mapped or submitted this round, and the project keeps separation of duties (Setup): another engineer of the project confirms it. You may still return it with comments.';
    mockApi({ [REVIEW]: submittedReview({ canConfirm: { allowed: false, reason } }) });
    panel();
    const why = await screen.findByTestId('no-confirm-reason');
    expect(why).toHaveTextContent('Why Confirm is not offered to you');
    expect(why).toHaveTextContent(reason);
    expect(screen.queryByRole('tab', { name: 'Confirm' })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Confirm the round' })).not.toBeInTheDocument();
    expect(screen.getByRole('form', { name: 'Return the round' })).toBeInTheDocument();
  });

  it('the engineer accepts a red rule as a standing condition for a range with a written reason, and may withdraw it', async () => {
    const rule = {
      ruleId: 'rule-adv',
      level: 'red' as const,
      summary: 'A set or feature adverse to the drive → red',
      detail: 'S1 (150/70) is very unfavourable for the drive',
      action: 'Tell the engineer.',
      ownerRole: 'engineer',
      timeAllowedHours: 2,
      dueAt: '2026-11-30T12:00:00.000Z',
      minutesLeft: 60,
      overdue: false,
      acknowledgedAt: null,
      acknowledgement: null,
      canAcknowledge: false,
      canAccept: true,
    };
    const acceptedRule = {
      ruleId: 'rule-adv',
      level: 'red' as const,
      summary: rule.summary,
      detail: rule.detail,
      acceptanceId: 'acc-1',
      reason: 'S1 along the drive is covered by the class B bolting.',
      acceptedByName: 'Edda Ravenshaw',
      acceptedAt: '2026-11-30T11:00:00.000Z',
      fromChainage: 1000,
      toChainage: 1015,
      until: null,
      acceptedHere: true,
    };
    const api = mockApi({
      [REVIEW]: submittedReview({ rules: [rule] }),
      'POST /api/projects/p-1/rounds/r-1/triggers/rule-adv/accept': () =>
        jsonResponse(submittedReview({ rules: [], acceptedRules: [acceptedRule] })),
      'POST /api/projects/p-1/rounds/r-1/acceptances/acc-1/withdraw': () =>
        jsonResponse(submittedReview({ rules: [rule] })),
    });
    panel();
    const user = userEvent.setup();
    const item = await screen.findByTestId('round-rule');
    await user.click(within(item).getByRole('button', { name: 'Accept as a standing condition…' }));
    const form = within(item).getByRole('form', { name: /Accept the standing condition/ });
    expect(form).toHaveTextContent('A red rule is accepted only with your written reason');
    await user.type(within(form).getByRole('textbox', { name: /From chainage/ }), '1000');
    await user.type(within(form).getByRole('textbox', { name: /To chainage/ }), '1015');
    await user.type(within(form).getByRole('textbox', { name: /Your reason/ }), acceptedRule.reason);
    await user.click(within(form).getByRole('button', { name: 'Accept the condition' }));
    const accepted = await screen.findByTestId('accepted-rule');
    expect(accepted).toHaveTextContent('Accepted (red, not raising the level)');
    expect(accepted).toHaveTextContent('chainage 1000 to 1015 m');
    expect(await bodiesOf(api, '/api/projects/p-1/rounds/r-1/triggers/rule-adv/accept')).toEqual([
      { fromChainage: 1000, toChainage: 1015, until: null, reason: acceptedRule.reason },
    ]);
    await user.click(within(accepted).getByRole('button', { name: 'Withdraw the acceptance' }));
    await waitFor(() => expect(screen.queryByTestId('accepted-rule')).not.toBeInTheDocument());
    expect(screen.getByTestId('round-rule')).toBeInTheDocument();
  });
});
