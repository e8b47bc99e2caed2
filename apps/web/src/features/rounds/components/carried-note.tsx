import { Badge, Button, makeStyles, tokens } from '@fluentui/react-components';
import type { CarriedValue } from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { getIn, useFormikContext } from 'formik';
import { useRoundEdit } from '@/features/rounds/components/round-fields';
import { numberOf, type RoundFormValues } from '@/features/rounds/schemas/round-form';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXXS },
  line: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalS },
  caution: { color: tokens.colorNeutralForeground1, fontWeight: tokens.fontWeightSemibold },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

/**
 * Under a rating input: the value was carried from Ground or Joints (and from where), or was typed over
 * (with the carried value one tap away), and any caution that goes with it.
 */
export function CarriedNote({
  field,
  carried,
  unit,
  onUse,
}: {
  field: string;
  carried: CarriedValue | undefined;
  unit?: string;
  /** Besides putting the value in the field (e.g. marking Q's RQD as estimated). */
  onUse?: () => void;
}) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly } = useRoundEdit();
  if (carried === undefined) return null;
  const typed = numberOf(String(getIn(values, field) ?? ''));
  const same = typed === carried.value;
  const shown = `${carried.value}${unit ? ` ${unit}` : ''}`;
  return (
    <span className={styles.root} data-testid={`carried-${field}`}>
      <span className={styles.line}>
        {same ? (
          <>
            <Badge appearance="tint" color="brand" shape="rounded">
              carried
            </Badge>
            <span>{`from ${carried.source}`}</span>
          </>
        ) : (
          <>
            <span>
              {typed === null
                ? `${carried.source} gives ${shown}.`
                : `Typed here. ${carried.source} gives ${shown}.`}
            </span>
            {!readOnly && (
              <Button
                className={styles.button}
                onClick={() => {
                  void setFieldValue(field, String(carried.value));
                  onUse?.();
                }}
              >
                {`Use ${shown}`}
              </Button>
            )}
          </>
        )}
      </span>
      {carried.caution !== null && <span className={styles.caution}>{carried.caution}</span>}
    </span>
  );
}
