import { gsiFromRmr89, qValue, rmr89 } from '@roundbook/geomath';
import type { QInput, Rmr89Input } from '@roundbook/geomath';
import type { RatingOutcome, RoundRatings } from '@/features/rounds/api/types';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { qInputOf, rmrInputOf, valueOf } from '@/features/rounds/schemas/round-form';

/**
 * The ratings of the form as it is typed, computed with the same geomath functions and the same inputs
 * the server uses on save (its values replace these once saved). No formula lives here.
 */

const empty = (): RatingOutcome => ({ value: null, label: null, error: null, parts: {} });
const message = (e: unknown) => (e instanceof Error ? e.message : String(e));

export function liveRatings(values: RoundFormValues): RoundRatings {
  const q = empty();
  const qInput = qInputOf(values.q);
  if (qInput !== null) {
    try {
      const input = qInput as unknown as QInput;
      const r = qValue(input);
      q.value = r.q;
      q.label = r.rockClass;
      q.parts = {
        rqdUsed: r.rqdUsed,
        jnUsed: r.jnUsed,
        jrUsed: r.jrUsed,
        ja: input.ja,
        jw: input.jw,
        srf: input.srf,
      };
    } catch (e) {
      q.error = message(e);
    }
  }
  const rmr = empty();
  const gsi = empty();
  const rmrInput = rmrInputOf(values.rmr);
  const observed = valueOf(values.gsiObserved);
  if (rmrInput !== null) {
    try {
      const r = rmr89(rmrInput as unknown as Rmr89Input);
      rmr.value = r.total;
      rmr.label = `class ${r.rockClass} (${r.meaning.description})`;
      rmr.parts = { ...r.ratings, basic: r.basic, dryUnadjusted: r.dryUnadjusted };
      if (observed === null) {
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
  if (observed !== null) {
    gsi.value = observed;
    gsi.label = 'read from the GSI chart at the face';
  }
  return { q, rmr, gsi };
}
