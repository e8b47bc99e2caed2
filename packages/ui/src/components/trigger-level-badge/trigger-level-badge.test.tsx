import { FluentProvider } from '@fluentui/react-components';
import { render, screen } from '@testing-library/react';
import { roundbookLightTheme } from '../../theme/theme';
import { TriggerLevelBadge } from './trigger-level-badge';

describe('TriggerLevelBadge', () => {
  it.each([
    ['green', 'Green'],
    ['amber', 'Amber'],
    ['red', 'Red'],
  ] as const)('names the %s level in words', (level, word) => {
    render(
      <FluentProvider theme={roundbookLightTheme}>
        <TriggerLevelBadge level={level} prefix="Trigger: " />
      </FluentProvider>,
    );
    expect(screen.getByText(`Trigger: ${word}`)).toHaveAttribute('data-level', level);
  });

  it('says what is missing when there is no level', () => {
    render(
      <FluentProvider theme={roundbookLightTheme}>
        <TriggerLevelBadge level={null} noneLabel="no rules" />
      </FluentProvider>,
    );
    expect(screen.getByText('no rules')).toHaveAttribute('data-level', 'none');
  });
});
