// Colours of a stereonet scene. Pure data: the scene code never reads the DOM or React, so the same
// scene can be written out as an SVG file (or on the server, for the PDFs) with a print palette, and on
// screen with a palette of Fluent token variables (components/screen-palette.ts).
import { SET_COLOURS_LIGHT } from '@roundbook/domain';

/** Every colour a scene uses, by what it is for. Any CSS colour (or var(--token)) is accepted. */
export interface StereonetPalette {
  /** Behind the net (also the stripe colour inside filled pole symbols). */
  paper: string;
  /** Primitive, cardinal marks, text. */
  ink: string;
  /** Degree scale, secondary text. */
  muted: string;
  /** Net grid lines. */
  grid: string;
  /** Tunnel axis and drive arrow. */
  axis: string;
  /** Zone where planes strike along the tunnel and dip 45° or more. */
  adverseStrong: string;
  /** Zone where planes strike along the tunnel and dip 20–45°. */
  adverseWeak: string;
  /** Density contour fill (drawn with increasing opacity per level) and lines. */
  contourFill: string;
  contourLine: string;
  /** Friction circle and its label. */
  friction: string;
  /** Daylight envelopes (tint and outline) and their labels. */
  daylight: string;
  /** Intersection lines of set pairs (star and label). */
  intersection: string;
  /** Poles in no set ("random"). */
  random: string;
  /** Set colours, in set order (S1, S2, …), repeated when there are more sets. */
  sets: readonly string[];
}

/** Roundbook's set colours for light paper (packages/domain, shared with the sketch and its PNG). */
export { SET_COLOURS_LIGHT };

/** Set colours for the high-contrast theme: bright, saturated, on black. */
export const SET_COLOURS_HIGH_CONTRAST: readonly string[] = [
  '#00e5ff',
  '#ffe14d',
  '#ff7ad9',
  '#8cff66',
  '#ffa040',
  '#c2b3ff',
];

/** Print palette (SVG files, PDFs): white paper. */
export const PRINT_PALETTE: StereonetPalette = {
  paper: '#ffffff',
  ink: '#1f2328',
  muted: '#5b6470',
  grid: '#c9ced6',
  axis: '#9c4a00',
  adverseStrong: 'rgba(214, 60, 40, 0.22)',
  adverseWeak: 'rgba(214, 120, 40, 0.12)',
  contourFill: '#3a5f8f',
  contourLine: '#2d4a70',
  friction: '#c2185b',
  daylight: '#6b5d00',
  intersection: '#1f2328',
  random: '#6b7280',
  sets: SET_COLOURS_LIGHT,
};

/** Print palette for the high-contrast theme: black paper, white ink. */
export const PRINT_HIGH_CONTRAST_PALETTE: StereonetPalette = {
  paper: '#000000',
  ink: '#ffffff',
  muted: '#d0d0d0',
  grid: '#5a5a5a',
  axis: '#ffb347',
  adverseStrong: 'rgba(255, 90, 70, 0.40)',
  adverseWeak: 'rgba(255, 170, 70, 0.22)',
  contourFill: '#7fb2ff',
  contourLine: '#a9cbff',
  friction: '#ff5c5c',
  daylight: '#5cffd6',
  intersection: '#ffffff',
  random: '#e0e0e0',
  sets: SET_COLOURS_HIGH_CONTRAST,
};

export const setColour = (palette: StereonetPalette, setIndex: number): string =>
  palette.sets[setIndex % palette.sets.length];
