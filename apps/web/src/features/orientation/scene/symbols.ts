// Roundbook's own pole symbols. The outer shape (and the colour) says the set; the fill and the mark inside
// say the kind of discontinuity. Shapes are written as absolute SVG path data around a centre, so all the
// poles of one style can share a single path element (cheap with thousands of poles).
import { JOINT_KINDS, jointKindLabels } from '@roundbook/domain';
import type { JointKind } from '@roundbook/domain';

export type SymbolShape =
  'round' | 'square' | 'diamond' | 'triangle' | 'triangle-down' | 'hexagon' | 'bowtie';

/** Shape of each set in order (S1 square, S2 diamond, …); poles in no set are round. */
export const SET_SHAPES: readonly SymbolShape[] = [
  'square',
  'diamond',
  'triangle',
  'triangle-down',
  'hexagon',
  'bowtie',
];
export const RANDOM_SHAPE: SymbolShape = 'round';

export const setShape = (setIndex: number): SymbolShape => SET_SHAPES[setIndex % SET_SHAPES.length];

/** How a kind is drawn inside its set's shape. */
export interface KindStyle {
  /** Solid (filled with the set colour) or open (outline only). */
  fill: 'solid' | 'open';
  /** Outline width as a multiple of the normal line. */
  outline: 1 | 2;
  /** A mark drawn inside: a stripe across (paper-coloured on a solid symbol), upright, slanted, or a dot. */
  mark: 'none' | 'across' | 'upright' | 'slant' | 'dot';
}

/** Roundbook's kind styles (our own design). */
export const KIND_STYLES: Readonly<Record<JointKind, KindStyle>> = {
  joint: { fill: 'solid', outline: 1, mark: 'none' },
  bedding: { fill: 'solid', outline: 1, mark: 'across' },
  foliation: { fill: 'open', outline: 1, mark: 'across' },
  fault: { fill: 'open', outline: 2, mark: 'dot' },
  'shear-zone': { fill: 'open', outline: 2, mark: 'slant' },
  vein: { fill: 'open', outline: 1, mark: 'none' },
  contact: { fill: 'open', outline: 1, mark: 'upright' },
};

/** Words of the kind legend, in the vocabulary's order. */
export const KIND_LEGEND: ReadonlyArray<{ kind: JointKind; label: string; style: KindStyle }> =
  JOINT_KINDS.map((kind) => ({ kind, label: jointKindLabels[kind], style: KIND_STYLES[kind] }));

const f = (n: number): string => String(Math.round(n * 100) / 100);

function polygon(x: number, y: number, points: Array<[number, number]>): string {
  return points.map(([px, py], i) => `${i === 0 ? 'M' : 'L'}${f(x + px)} ${f(y + py)}`).join(' ') + ' Z';
}

function regular(x: number, y: number, r: number, sides: number, rotation: number): string {
  const pts: Array<[number, number]> = [];
  for (let i = 0; i < sides; i++) {
    const a = rotation + (2 * Math.PI * i) / sides;
    pts.push([r * Math.sin(a), -r * Math.cos(a)]);
  }
  return polygon(x, y, pts);
}

/** Path data of a shape of "radius" r centred at (x, y) in SVG coordinates (y down). */
export function shapePath(shape: SymbolShape, x: number, y: number, r: number): string {
  switch (shape) {
    case 'round':
      return `M${f(x - r)} ${f(y)} A${f(r)} ${f(r)} 0 1 0 ${f(x + r)} ${f(y)} A${f(r)} ${f(r)} 0 1 0 ${f(x - r)} ${f(y)} Z`;
    case 'square': {
      const h = r * 0.86;
      return polygon(x, y, [
        [-h, -h],
        [h, -h],
        [h, h],
        [-h, h],
      ]);
    }
    case 'diamond':
      return regular(x, y, r * 1.15, 4, 0);
    case 'triangle':
      return regular(x, y, r * 1.2, 3, 0);
    case 'triangle-down':
      return regular(x, y, r * 1.2, 3, Math.PI);
    case 'hexagon':
      return regular(x, y, r * 1.05, 6, Math.PI / 6);
    case 'bowtie': {
      const h = r * 0.95;
      return polygon(x, y, [
        [-h, -h],
        [h, h],
        [h, -h],
        [-h, h],
      ]);
    }
  }
}

/** Path data of a kind's inner mark (stroked), or '' for none; a dot is a tiny filled round. */
export function markPath(mark: KindStyle['mark'], x: number, y: number, r: number): string {
  const m = r * 0.62;
  switch (mark) {
    case 'none':
      return '';
    case 'across':
      return `M${f(x - m)} ${f(y)} H${f(x + m)}`;
    case 'upright':
      return `M${f(x)} ${f(y - m)} V${f(y + m)}`;
    case 'slant':
      return `M${f(x - m)} ${f(y + m)} L${f(x + m)} ${f(y - m)}`;
    case 'dot':
      return shapePath('round', x, y, r * 0.3);
  }
}
