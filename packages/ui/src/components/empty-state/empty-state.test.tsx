import { FluentProvider } from '@fluentui/react-components';
import { render, screen } from '@testing-library/react';
import { roundbookLightTheme } from '../../theme/theme';
import { EmptyState } from './empty-state';

describe('EmptyState', () => {
  it('renders a titled region with its message and action', () => {
    render(
      <FluentProvider theme={roundbookLightTheme}>
        <EmptyState
          title="No headings yet"
          message="An admin adds them in Setup."
          action={<button>Refresh</button>}
        />
      </FluentProvider>,
    );
    const region = screen.getByRole('region', { name: 'No headings yet' });
    expect(region).toHaveTextContent('An admin adds them in Setup.');
    expect(screen.getByRole('heading', { level: 2, name: 'No headings yet' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Refresh' })).toBeInTheDocument();
  });
});
