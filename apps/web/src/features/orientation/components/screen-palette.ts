import { tokens } from '@fluentui/react-components';
import type { StereonetPalette } from '@/features/orientation/scene/palette';
import {
  PRINT_HIGH_CONTRAST_PALETTE,
  PRINT_PALETTE,
  SET_COLOURS_HIGH_CONTRAST,
  SET_COLOURS_LIGHT,
} from '@/features/orientation/scene/palette';

/**
 * The palette on screen: neutrals from the Fluent theme's tokens (so the net reads in both themes), set
 * colours from Roundbook's own lists (the high-contrast theme has its own).
 */
export function screenPalette(highContrast: boolean): StereonetPalette {
  const print = highContrast ? PRINT_HIGH_CONTRAST_PALETTE : PRINT_PALETTE;
  return {
    ...print,
    paper: tokens.colorNeutralBackground1,
    ink: tokens.colorNeutralForeground1,
    muted: tokens.colorNeutralForeground3,
    grid: tokens.colorNeutralStroke2,
    random: tokens.colorNeutralForeground3,
    intersection: tokens.colorNeutralForeground1,
    sets: highContrast ? SET_COLOURS_HIGH_CONTRAST : SET_COLOURS_LIGHT,
  };
}

/** The palette for a downloaded file: concrete colours, as the screen's theme shows them. */
export function filePalette(highContrast: boolean): StereonetPalette {
  return highContrast ? PRINT_HIGH_CONTRAST_PALETTE : PRINT_PALETTE;
}
