import { FluentProvider } from '@fluentui/react-components';
import { render, screen } from '@testing-library/react';
import { roundbookHighContrastTheme, roundbookLightTheme } from '../../theme/theme';
import { RoleBadge } from './role-badge';

describe('RoleBadge', () => {
  it.each([
    ['admin', 'Project admin'],
    ['geologist', 'Geologist'],
    ['engineer', 'Engineer'],
    ['supervisor', 'Shift supervisor'],
    ['viewer', 'Read only'],
  ] as const)('names the %s role as "%s"', (role, label) => {
    render(
      <FluentProvider theme={roundbookLightTheme}>
        <RoleBadge role={role} />
      </FluentProvider>,
    );
    expect(screen.getByText(label)).toBeInTheDocument();
  });
});

describe('Roundbook themes', () => {
  it('use Open Sans as the base font in both modes', () => {
    expect(roundbookLightTheme.fontFamilyBase).toMatch(/^'Open Sans'/);
    expect(roundbookHighContrastTheme.fontFamilyBase).toMatch(/^'Open Sans'/);
  });

  it('put the brand ramp on primary buttons in the light theme', () => {
    expect(roundbookLightTheme.colorBrandBackground).toBe('#116f79');
    expect(roundbookHighContrastTheme.colorNeutralBackground1).not.toBe(
      roundbookLightTheme.colorNeutralBackground1,
    );
  });
});
