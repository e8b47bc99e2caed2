import type { ProfileShape } from '@/api/contract';

export interface ProfileSize {
  shape: ProfileShape;
  /** Metres */
  width: number;
  /** Metres, invert to crown */
  height: number;
}

const f = (n: number) => Number(n.toFixed(3));

/**
 * The outline of an excavation profile as an SVG path, in metres, with x across (0 on the centre
 * line) and y up from the invert (0). Each shape is drawn in Roundbook's own simple way:
 * - rectangular: a box;
 * - circular: a circle of the width;
 * - D-shaped: straight walls with a half-ellipse crown as wide as the profile;
 * - horseshoe: a half-ellipse crown over walls that narrow in a gentle curve to a flat invert
 *   three quarters as wide.
 * The path's y grows upwards; the preview flips it for the screen.
 */
export function profileOutline({ shape, width, height }: ProfileSize): string {
  const w = width / 2;
  switch (shape) {
    case 'rectangular':
      return `M ${f(-w)} 0 L ${f(w)} 0 L ${f(w)} ${f(height)} L ${f(-w)} ${f(height)} Z`;
    case 'circular': {
      const r = width / 2;
      return `M ${f(-r)} ${f(r)} A ${f(r)} ${f(r)} 0 1 0 ${f(r)} ${f(r)} A ${f(r)} ${f(r)} 0 1 0 ${f(-r)} ${f(r)} Z`;
    }
    case 'd-shaped': {
      const rise = Math.min(w, height);
      const wall = height - rise;
      return `M ${f(-w)} 0 L ${f(w)} 0 L ${f(w)} ${f(wall)} A ${f(w)} ${f(rise)} 0 0 1 ${f(-w)} ${f(wall)} Z`;
    }
    case 'horseshoe': {
      const rise = Math.min(w, height * 0.6);
      const spring = height - rise;
      const foot = w * 0.75;
      return [
        `M ${f(-foot)} 0`,
        `L ${f(foot)} 0`,
        `Q ${f(w)} ${f(spring * 0.35)} ${f(w)} ${f(spring)}`,
        `A ${f(w)} ${f(rise)} 0 0 1 ${f(-w)} ${f(spring)}`,
        `Q ${f(-w)} ${f(spring * 0.35)} ${f(-foot)} 0`,
        'Z',
      ].join(' ');
    }
  }
}
