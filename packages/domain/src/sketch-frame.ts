// The heading's profile as the sketch draws it (geomath profile.ts, at true scale) for a round's stage: the
// frame both the browser canvas and the SVG/PNG render place the sketch document in.
import { profileOutline, stagePart, type ProfilePoint, type ProfileShape } from '@roundbook/geomath';
import type { Stage } from './vocabulary.js';

export interface SketchProfileInput {
  profileShape: ProfileShape;
  profileWidth: number;
  profileHeight: number;
  axisHeight: number;
  benchHeight?: number | null;
}

export interface FaceFrame {
  /** The whole excavation line, metres. */
  outline: ProfilePoint[];
  /** The round's stage part of it (the face actually mapped). */
  part: ProfilePoint[];
  width: number;
  height: number;
  axisHeight: number;
  /** Height of the springline: where the profile is widest (the highest such point). */
  springline: number;
  /** Floor line of the top heading / top of the bench, when the stage is one of them. */
  benchLine: number | null;
  /** Lowest and highest heights of the stage part. */
  bottom: number;
  top: number;
}

/** The face frame of a heading for a stage; null when the heading's profile cannot be drawn. */
export function faceFrameOf(heading: SketchProfileInput, stage: Stage): FaceFrame | null {
  try {
    const input = {
      shape: heading.profileShape,
      width: heading.profileWidth,
      height: heading.profileHeight,
      axisHeight: heading.axisHeight,
      ...(heading.benchHeight !== null && heading.benchHeight !== undefined
        ? { benchLine: heading.benchHeight }
        : {}),
    };
    const outline = profileOutline(input);
    const part = stagePart(input, stage === 'invert' ? 'full-face' : stage);
    const half = outline.points.reduce((m, p) => Math.max(m, Math.abs(p[0])), 0);
    const springline = outline.points
      .filter((p) => Math.abs(p[0]) >= half - 1e-6)
      .reduce((m, p) => Math.max(m, p[1]), 0);
    const benchLine = stage === 'top-heading' ? part.bottom : stage === 'bench' ? part.top : null;
    return {
      outline: outline.points,
      part: part.points,
      width: outline.width,
      height: outline.height,
      axisHeight: heading.axisHeight,
      springline,
      benchLine,
      bottom: part.bottom,
      top: part.top,
    };
  } catch {
    return null;
  }
}
