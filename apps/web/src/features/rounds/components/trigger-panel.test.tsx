import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { TriggerFiring } from '@/features/rounds/api/types';
import { formatTimeAllowed, TriggerPanel } from '@/features/rounds/components/trigger-panel';
import { renderWithProviders } from '@/features/rounds/testing/round-fixtures';

// Invented rules of an invented project.
const firing = (
  n: number,
  level: TriggerFiring['level'],
  extra: Partial<TriggerFiring> = {},
): TriggerFiring => ({
  ruleId: `rule-${n}`,
  level,
  summary: `Rule ${n} in words`,
  detail: `Why rule ${n} fires`,
  action: `What to do for rule ${n}`,
  ownerRole: 'engineer',
  timeAllowedHours: 4,
  ...extra,
});

describe('TriggerPanel', () => {
  it('names the level in words and lists each firing with why, what, who and when', () => {
    renderWithProviders(
      <TriggerPanel
        level="red"
        firings={[
          firing(1, 'red', {
            summary: 'Q < 0.1 → red',
            detail: 'Q is 0.08 on this round',
            action: 'Stop advance; call the design engineer to the face',
            ownerRole: 'engineer',
            timeAllowedHours: 0,
          }),
          firing(2, 'amber', {
            summary: 'Water inflow per 10 m > 5 l/min → amber',
            detail: 'Inflow is 6 l/min per 10 m',
            action: 'Probe ahead before the next round',
            ownerRole: 'supervisor',
            timeAllowedHours: 12,
          }),
        ]}
      />,
    );
    const panel = screen.getByRole('region', { name: 'Trigger level' });
    expect(panel).toHaveTextContent('2 rules fire, worst first. As of the last save.');
    const items = within(panel).getAllByTestId('trigger-firing');
    expect(items).toHaveLength(2);

    expect(items[0]).toHaveTextContent('Red');
    expect(items[0]).toHaveTextContent('Q < 0.1 → red');
    expect(items[0]).toHaveTextContent('Why it firesQ is 0.08 on this round');
    expect(items[0]).toHaveTextContent('What to doStop advance; call the design engineer to the face');
    expect(items[0]).toHaveTextContent('Who actsEngineer, at once');

    expect(items[1]).toHaveTextContent('Amber');
    expect(items[1]).toHaveTextContent('Inflow is 6 l/min per 10 m');
    expect(items[1]).toHaveTextContent('Who actsShift supervisor, within 12 h');
    // The panel's own level, as a word next to its colour.
    expect(within(panel).getAllByText('Red')[0]).toHaveAttribute('data-level', 'red');
    expect(screen.queryByRole('button', { name: /more/ })).not.toBeInTheDocument();
  });

  it('folds firings beyond the first two away and opens them on demand', async () => {
    const user = userEvent.setup();
    renderWithProviders(
      <TriggerPanel
        level="red"
        firings={[firing(1, 'red'), firing(2, 'amber'), firing(3, 'amber'), firing(4, 'green')]}
      />,
    );
    expect(screen.getAllByTestId('trigger-firing')).toHaveLength(2);
    const more = screen.getByRole('button', { name: 'Show 2 more rules' });
    expect(more).toHaveAttribute('aria-expanded', 'false');
    await user.click(more);
    const items = screen.getAllByTestId('trigger-firing');
    expect(items).toHaveLength(4);
    expect(items[3]).toHaveTextContent('Green');
    expect(items[3]).toHaveTextContent('Rule 4 in words');
    await user.click(screen.getByRole('button', { name: 'Show fewer' }));
    expect(screen.getAllByTestId('trigger-firing')).toHaveLength(2);
  });

  it('says so when the project has no rules, or when none fires', () => {
    const { unmount } = renderWithProviders(<TriggerPanel level={null} firings={[]} />);
    expect(screen.getByText('no rules')).toBeInTheDocument();
    expect(screen.getByRole('region', { name: 'Trigger level' })).toHaveTextContent(
      'The project has no trigger rules yet',
    );
    unmount();
    renderWithProviders(<TriggerPanel level="green" firings={[]} />);
    expect(screen.getByText('Green')).toHaveAttribute('data-level', 'green');
    expect(screen.getByText('No rule fires on this round. As of the last save.')).toBeInTheDocument();
    expect(screen.queryAllByTestId('trigger-firing')).toHaveLength(0);
  });

  it('says the time allowed the way a shift says it', () => {
    expect(formatTimeAllowed(0)).toBe('at once');
    expect(formatTimeAllowed(2)).toBe('within 2 h');
    expect(formatTimeAllowed(1.5)).toBe('within 1.5 h');
    expect(formatTimeAllowed(72)).toBe('within 72 h (3 days)');
  });

  it('says "not evaluated (2 rules)" and, when asked, which data are missing, never "no rules", when the project has rules (issue 10 item 8, issue 19 items 4 and 10)', async () => {
    renderWithProviders(
      <TriggerPanel
        level={null}
        firings={[]}
        live
        notEvaluated={[
          { summary: 'Q < 1 → amber', detail: 'Q is not recorded yet' },
          { summary: 'Inflow per 10 m > 5 l/min → amber', detail: 'the inflow is not recorded yet' },
        ]}
      />,
    );
    const panel = screen.getByTestId('trigger-panel');
    expect(within(panel).getByText('not evaluated (2 rules)')).toBeInTheDocument();
    // One line until asked for: the rules and what each waits for are behind a toggle.
    expect(panel).toHaveTextContent('2 rules wait for the data they read.');
    expect(panel).not.toHaveTextContent('Q is not recorded yet');
    const toggle = within(panel).getByRole('button', { name: 'Show which rules wait' });
    expect(toggle).toHaveAttribute('aria-expanded', 'false');
    await userEvent.setup().click(toggle);
    expect(within(panel).getByTestId('rules-waiting')).toHaveTextContent(
      'Q < 1 → amber — Q is not recorded yet',
    );
    expect(panel).toHaveTextContent('Inflow per 10 m > 5 l/min → amber — the inflow is not recorded yet');
    expect(within(panel).getByRole('button', { name: 'Hide the waiting rules' })).toHaveAttribute(
      'aria-expanded',
      'true',
    );
    expect(panel).not.toHaveTextContent('no trigger rules');
  });

  it('lists the accepted standing conditions apart, as not raising the level', () => {
    renderWithProviders(
      <TriggerPanel
        level="amber"
        firings={[firing(2, 'amber')]}
        accepted={[
          {
            ruleId: 'rule-1',
            summary: 'A set or feature adverse to the drive → red',
            reason: 'Covered by the class bolting.',
            acceptedByName: 'Edda Ravenshaw',
          },
        ]}
      />,
    );
    expect(screen.getByTestId('accepted-conditions')).toHaveTextContent(
      'Accepted, not raising the level: A set or feature adverse to the drive → red — Edda Ravenshaw: Covered by the class bolting.',
    );
  });
});
