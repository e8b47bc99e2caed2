import { FluentProvider } from '@fluentui/react-components';
import { render, screen } from '@testing-library/react';
import { roundbookLightTheme } from '../theme/theme';
import { FormSection } from './form-section';

describe('FormSection', () => {
  it('is a group named by its title, holding its fields', () => {
    render(
      <FluentProvider theme={roundbookLightTheme}>
        <FormSection title="Excavation profile">
          <label>
            Width <input name="width" />
          </label>
        </FormSection>
      </FluentProvider>,
    );
    const group = screen.getByRole('group', { name: 'Excavation profile' });
    expect(group).toContainElement(screen.getByRole('textbox', { name: 'Width' }));
  });
});
