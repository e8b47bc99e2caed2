import { gsiFromRmr89, qValue, rmr89 } from '@roundbook/geomath';
import type { QInput, Rmr89Input } from '@roundbook/geomath';

/** One rating as computed from its inputs: the value, its class in words, why it failed, and the parts. */
export interface RatingOutcome {
  value: number | null;
  label: string | null;
  error: string | null;
  /** Intermediate values and ratings, for showing the inputs beside the result. */
  parts: Record<string, number>;
  /** Inputs accepted but worth a second look (Q: values between table rows, the Jr +1 rule). */
  warnings?: string[];
  /** The table edition used (Q: geomath qValue().edition). */
  edition?: string;
}

export interface RoundRatings {
  q: RatingOutcome;
  rmr: RatingOutcome;
  gsi: RatingOutcome;
}

/** The RMR89 inputs as recorded: the orientation adjustment is an assessment, or not assessed yet. */
export type RmrRecord = Omit<Rmr89Input, 'orientation'> & {
  orientation:
    | {
        kind: 'assessment';
        assessment: 'very favourable' | 'favourable' | 'fair' | 'unfavourable' | 'very unfavourable';
      }
    | { kind: 'not assessed' };
};
/**
 * The Q inputs as recorded: geomath's QInput, plus the governing discontinuity Jr and Ja were taken from
 * (a joint of the round by id, or a set by label) and whether random joints were seen beside the sets.
 */
export type QRecord = QInput & {
  governingJointId?: string | null;
  governingSetLabel?: string | null;
  randomJoints?: boolean | null;
};

/** The editions the ratings follow, stamped on every assessment. */
export const RATING_EDITIONS = {
  q: 'Q-system, Barton et al. 1974 with the Grimstad & Barton 1993 SRF table (NGI 2015 handbook)',
  rmr: 'RMR89, Bieniawski 1989 (Table 4.1 with its notes)',
  gsi: 'GSI, Hoek & Marinos 2000; from RMR89 as GSI = RMR89 (dry, unadjusted) − 5 (Hoek et al. 1995)',
} as const;

const message = (e: unknown): string => (e instanceof Error ? e.message : String(e));
const empty = (): RatingOutcome => ({ value: null, label: null, error: null, parts: {} });

/** Q, RMR89 and GSI from the recorded inputs, every number from packages/geomath. */
export function computeRatings(input: {
  qInput: QRecord | null;
  rmrInput: RmrRecord | null;
  gsiObserved: number | null;
}): RoundRatings {
  const q = empty();
  if (input.qInput) {
    try {
      const r = qValue(input.qInput);
      q.value = r.q;
      q.label = r.rockClass;
      q.edition = r.edition;
      q.warnings = r.warnings.map((w) => w.message);
      q.parts = {
        rqdUsed: r.rqdUsed,
        jnUsed: r.jnUsed,
        jrUsed: r.jrUsed,
        ja: input.qInput.ja,
        jw: input.qInput.jw,
        srf: input.qInput.srf,
      };
    } catch (e) {
      q.error = message(e);
    }
  }
  const rmr = empty();
  const gsi = empty();
  if (input.rmrInput) {
    try {
      const r = rmr89(input.rmrInput);
      rmr.value = r.total;
      rmr.label = `class ${r.rockClass} (${r.meaning.description})`;
      rmr.parts = { ...r.ratings, basic: r.basic, dryUnadjusted: r.dryUnadjusted };
      if (input.gsiObserved === null) {
        try {
          gsi.value = gsiFromRmr89(r.dryUnadjusted);
          gsi.label = 'from RMR89 (dry, no orientation adjustment)';
          gsi.parts = { rmr89Dry: r.dryUnadjusted };
        } catch (e) {
          gsi.error = message(e);
        }
      }
    } catch (e) {
      rmr.error = message(e);
    }
  }
  if (input.gsiObserved !== null) {
    gsi.value = input.gsiObserved;
    gsi.label = 'read from the GSI chart at the face';
  }
  return { q, rmr, gsi };
}
