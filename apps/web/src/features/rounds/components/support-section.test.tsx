import { explainSuggestion } from '@roundbook/domain';
import { screen, within } from '@testing-library/react';
import { Formik } from 'formik';
import { RoundEditContext } from '@/features/rounds/components/round-fields';
import { SupportSection } from '@/features/rounds/components/support-section';
import { formValuesOf } from '@/features/rounds/schemas/round-form';
import { draftRound, renderWithProviders, supportClasses } from '@/features/rounds/testing/round-fixtures';

function renderSection(q: number | null, rmr: number | null) {
  const suggestion = explainSuggestion(supportClasses, q, rmr);
  renderWithProviders(
    <RoundEditContext.Provider value={{ readOnly: false, serverErrors: {} }}>
      <Formik initialValues={formValuesOf(draftRound)} onSubmit={() => undefined}>
        <SupportSection
          classes={supportClasses}
          suggestedClassIds={suggestion.fitting}
          suggestion={suggestion}
          plannedRoundLength={3}
          canSubmit
          submitting={false}
          submitMessage={null}
          onSubmit={() => undefined}
        />
      </Formik>
    </RoundEditContext.Provider>,
  );
  return suggestion;
}

const cardOf = (code: string) =>
  screen.getAllByTestId('support-class').find((c) => c.textContent?.startsWith(code))!;

describe('SupportSection (issue 19 item 1)', () => {
  it('prints each band as it is applied: Q half-open, RMR89 with both ends', () => {
    renderSection(5, 50);
    expect(cardOf('B')).toHaveTextContent('1 ≤ Q < 10 · RMR89 44–64');
    expect(cardOf('A')).toHaveTextContent('Q ≥ 10 · RMR89 ≥ 65');
    expect(cardOf('C')).toHaveTextContent('0.1 ≤ Q < 1');
  });

  it('at Q 10.0 and RMR89 50 no class fits both: it says which rating each follows and offers the more cautious first', () => {
    const suggestion = renderSection(10, 50);
    expect(suggestion.fitting).toEqual([]);
    expect(screen.getByText('No class fits the ratings as saved')).toBeInTheDocument();
    expect(screen.getByTestId('support-reason')).toHaveTextContent(suggestion.reason);
    expect(suggestion.reason).toMatch(/more cautious B is suggested/);
    const first = screen.getAllByTestId('support-class')[0];
    expect(first).toHaveTextContent('B');
    expect(within(first).getByText('The more cautious of the two')).toBeInTheDocument();
    // Offered once: not again among the other classes.
    expect(screen.getAllByTestId('support-class').filter((c) => c.textContent?.startsWith('B'))).toHaveLength(
      1,
    );
  });
});
