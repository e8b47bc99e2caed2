import { createLightTheme, teamsHighContrastTheme } from '@fluentui/react-components';
import type { Theme } from '@fluentui/react-components';
import { roundbookBrand } from './brand';

/** Open Sans ships with the app (@fontsource); the rest is the fallback while it loads. */
export const roundbookFontFamily = "'Open Sans', 'Segoe UI', system-ui, -apple-system, sans-serif";

/** Everyday theme: light surfaces with the Roundbook brand ramp. */
export const roundbookLightTheme: Theme = {
  ...createLightTheme(roundbookBrand),
  fontFamilyBase: roundbookFontFamily,
};

/**
 * Theme for poor light underground: black surfaces, white text and bright focus colours,
 * derived from Fluent's high-contrast theme so every control keeps strong outlines.
 */
export const roundbookHighContrastTheme: Theme = {
  ...teamsHighContrastTheme,
  fontFamilyBase: roundbookFontFamily,
};

export type RoundbookThemeMode = 'light' | 'high-contrast';

export function getRoundbookTheme(mode: RoundbookThemeMode): Theme {
  return mode === 'high-contrast' ? roundbookHighContrastTheme : roundbookLightTheme;
}
