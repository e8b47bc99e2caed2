import { carriedRatingInputs, type CarriedInput, type CarriedValue, type RoundSet } from '@roundbook/domain';
import type { JvEdition } from '@roundbook/geomath';
import { getIn, useFormikContext } from 'formik';
import { useEffect, useMemo, useRef } from 'react';
import { numberOf, type RoundFormValues } from '@/features/rounds/schemas/round-form';

/** The form field each carried value goes into. */
export const CARRIED_FIELDS: Record<CarriedInput, string> = {
  is50: 'rmr.is50',
  rmrRqd: 'rmr.rqd',
  spacingM: 'rmr.spacingM',
  inflowPer10m: 'rmr.inflowPer10m',
  qRqd: 'q.rqd',
};

export type CarriedInputs = Partial<Record<CarriedInput, CarriedValue>>;

/**
 * Values typed in Ground and Joints carried into the rating inputs (issue 19, item 3): an empty input takes
 * the value, and an input that still holds the value carried before follows when the source changes; an
 * input typed over keeps what was typed. Nothing is written while the round is read only, nor before the person
 * has changed anything (opening a round never saves it); until then an empty input offers the value.
 */
export function useCarriedInputs(opts: {
  sets: readonly RoundSet[];
  inflowPer10m: number | null;
  readOnly: boolean;
  jvEdition: JvEdition;
}): CarriedInputs {
  const { values, setFieldValue, dirty } = useFormikContext<RoundFormValues>();
  const is50 = numberOf(values.pointLoadIs50);
  const carried = useMemo(
    () =>
      carriedRatingInputs({
        pointLoadIs50: is50 === null || Number.isNaN(is50) ? null : is50,
        inflowPer10m: opts.inflowPer10m,
        sets: opts.sets,
        jvEdition: opts.jvEdition,
      }),
    [is50, opts.inflowPer10m, opts.sets, opts.jvEdition],
  );
  const key = JSON.stringify(Object.entries(carried).map(([k, v]) => [k, v.value]));
  const valuesRef = useRef(values);
  // Effects run in order: the carry below reads the values of this render.
  useEffect(() => {
    valuesRef.current = values;
  });
  const before = useRef<Partial<Record<CarriedInput, number>>>({});

  useEffect(() => {
    const now: Partial<Record<CarriedInput, number>> = {};
    for (const [k, v] of Object.entries(carried) as [CarriedInput, CarriedValue][]) now[k] = v.value;
    // Opening a round writes nothing: values are carried once the person has changed something here.
    if (opts.readOnly || !dirty) {
      before.current = now;
      return;
    }
    const current = valuesRef.current;
    for (const input of Object.keys(CARRIED_FIELDS) as CarriedInput[]) {
      const field = CARRIED_FIELDS[input];
      // Q's RQD chosen from its table row stays as chosen.
      if (input === 'qRqd' && current.q.rows.rqd !== undefined) continue;
      const typed = String(getIn(current, field) ?? '');
      const next = now[input];
      const prev = before.current[input];
      const followed = prev !== undefined && numberOf(typed) === prev;
      if (next === undefined) {
        if (followed) void setFieldValue(field, '');
        continue;
      }
      if (typed.trim() === '' || (followed && next !== prev)) {
        void setFieldValue(field, String(next));
        if (input === 'qRqd') void setFieldValue('q.rqdFromJv', true);
      }
    }
    before.current = now;
    // `key` stands for `carried` (the values only); setFieldValue is stable.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, opts.readOnly, dirty]);

  return carried;
}
