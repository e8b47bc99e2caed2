import { requireInRange, requirePositive } from './rating-bands.js';

/**
 * Excavation support ratio (ESR) by excavation category, 2015 handbook list (from memory; the values that
 * also appear in the 1974 list were seen in Maidl, Thewes & Maidl, tunnelling handbook, Table 2-15).
 * Descriptions are our own wording.
 */
export interface EsrRow {
  readonly category: 'A' | 'B' | 'C' | 'D' | 'E' | 'F' | 'G';
  readonly description: string;
  readonly esr: number;
  readonly range?: readonly [number, number];
  readonly check: 'seen' | 'from memory';
}

export const ESR_TABLE: readonly EsrRow[] = [
  {
    category: 'A',
    description: 'Temporary mine openings and the like',
    esr: 3.5,
    range: [2, 5],
    check: 'from memory',
  },
  { category: 'B', description: 'Vertical shafts, circular section', esr: 2.5, check: 'seen' },
  { category: 'B', description: 'Vertical shafts, rectangular or square section', esr: 2.0, check: 'seen' },
  {
    category: 'C',
    description:
      'Permanent mine openings, hydropower water tunnels (not high-pressure penstocks), water-supply tunnels, pilot tunnels, drifts and headings for large openings',
    esr: 1.6,
    check: 'seen',
  },
  {
    category: 'D',
    description: 'Minor road and railway tunnels, surge chambers, access and sewage tunnels',
    esr: 1.3,
    check: 'from memory',
  },
  {
    category: 'E',
    description:
      'Power stations, storage rooms, water-treatment plants, major road and railway tunnels, civil-defence chambers, portals, intersections',
    esr: 1.0,
    check: 'seen',
  },
  {
    category: 'F',
    description: 'Underground nuclear power stations, railway stations, sports and public halls, factories',
    esr: 0.8,
    check: 'seen',
  },
  {
    category: 'G',
    description:
      'Very important caverns and openings with a long life (about 100 years) or no access for maintenance',
    esr: 0.5,
    check: 'from memory',
  },
];

/** ESR values accepted by qSupport: the extremes of ESR_TABLE. */
export const ESR_RANGE: readonly [number, number] = [0.5, 5];

export interface QSupportInput {
  /** Q (> 0). */
  q: number;
  /** Span (roof) or wall height (walls), metres (> 0). */
  span: number;
  /** Excavation support ratio, 0.5–5 (ESR_TABLE). */
  esr: number;
}

export interface QSupportResult {
  /** De = span / ESR. */
  equivalentDimension: number;
  /** L = 2 + 0.15·B/ESR, metres. */
  boltLength: number;
  /** 2·ESR·Q^0.4, metres. */
  maxUnsupportedSpan: number;
}

/**
 * The support relations that go with the Q chart (Barton et al. 1974/1980, as reproduced in Hoek's
 * Practical Rock Engineering — from memory; checked against Maidl, Thewes & Maidl Table 2-15 text):
 * equivalent dimension, bolt length and maximum unsupported span. The support category itself is read
 * from the handbook chart, whose boundaries are curves; it is not computed here.
 */
export function qSupport(input: QSupportInput): QSupportResult {
  requirePositive('Q', input.q);
  requirePositive('span', input.span, 'm');
  requireInRange('ESR', input.esr, ESR_RANGE[0], ESR_RANGE[1], 'excavation support ratio, see ESR_TABLE');
  const equivalentDimension = input.span / input.esr;
  return {
    equivalentDimension,
    boltLength: 2 + 0.15 * equivalentDimension,
    maxUnsupportedSpan: 2 * input.esr * Math.pow(input.q, 0.4),
  };
}
