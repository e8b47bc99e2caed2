import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Text,
  tokens,
} from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useMemo, useState } from 'react';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { conflictLabel, conflictValue } from '@/features/rounds/utils/conflict-labels';
import type { Side } from '@/lib/sync/merge';
import { applyChoices, threeWayMerge } from '@/lib/sync/merge';

export interface RoundConflictViewProps {
  /** The server's sentence, or ours. */
  message: string;
  /** Who saved the other version, when known. */
  changedBy?: string | null;
  /** The round both versions started from (null: not known on this device). */
  base: RoundFormValues | null;
  /** The typing on this device, as it is now. */
  mine: RoundFormValues;
  /** Their version, as the server has it. */
  theirs: RoundFormValues;
  /** Saves the merge (on top of their version). */
  onApply: (merged: RoundFormValues) => void;
  /** Drops this device's typing for their version (never the default). */
  onTakeTheirs: () => void;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalM },
  list: { margin: 0, paddingInlineStart: tokens.spacingHorizontalXL },
  question: {
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusMedium,
    padding: tokens.spacingHorizontalM,
    margin: 0,
  },
  legend: { fontWeight: tokens.fontWeightSemibold, paddingInline: tokens.spacingHorizontalXS },
  radio: { minHeight: `${TOUCH_TARGET_PX}px` },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

const ATOMIC = ['sketch'] as const;

/**
 * Someone saved the round while this device was typing. Fields only one side changed are merged without
 * a question; where both changed the same field, both values are shown and the person picks one per
 * field, with their own typing picked until they say otherwise. The main button saves that merge, so
 * the default never throws away the notes made at the face.
 */
export function RoundConflictView({
  message,
  changedBy,
  base,
  mine,
  theirs,
  onApply,
  onTakeTheirs,
}: RoundConflictViewProps) {
  const styles = useStyles();
  const result = useMemo(() => threeWayMerge(base, mine, theirs, { atomic: ATOMIC }), [base, mine, theirs]);
  const [choices, setChoices] = useState<Record<string, Side>>({});
  const label = (path: string) => conflictLabel(path, mine, theirs);
  const unique = (paths: string[]) => [...new Set(paths.map(label))];
  const fromTheirs = unique(result.fromTheirs);
  const fromMine = unique(result.fromMine);

  return (
    <section className={styles.root} aria-label="Changed on another device" data-testid="conflict-view">
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>
            {changedBy
              ? `${changedBy} saved this round while you were typing`
              : 'Saved elsewhere while you were typing'}
          </MessageBarTitle>
          {message} Nothing of yours is lost: your typing stays on this device until you save the merge.
        </MessageBarBody>
      </MessageBar>

      {fromTheirs.length > 0 && (
        <div data-testid="merged-theirs">
          <Text weight="semibold">Taken from their version (you had not changed these):</Text>
          <ul className={styles.list}>
            {fromTheirs.map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
        </div>
      )}
      {fromMine.length > 0 && (
        <div data-testid="merged-mine">
          <Text weight="semibold">Kept from yours (they had not changed these):</Text>
          <ul className={styles.list}>
            {fromMine.map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
        </div>
      )}

      {result.conflicts.length > 0 ? (
        <>
          <Text weight="semibold">{`Changed on both sides — choose for each (${result.conflicts.length}):`}</Text>
          {result.conflicts.map((c) => (
            <fieldset key={c.path} className={styles.question} data-testid="conflict-field">
              <legend className={styles.legend}>{label(c.path)}</legend>
              <RadioGroup
                value={choices[c.path] ?? 'mine'}
                onChange={(_e, d) => setChoices((prev) => ({ ...prev, [c.path]: d.value as Side }))}
                aria-label={`Which value of ${label(c.path)}`}
              >
                <Radio className={styles.radio} value="mine" label={`Yours: ${conflictValue(c.mine)}`} />
                <Radio className={styles.radio} value="theirs" label={`Theirs: ${conflictValue(c.theirs)}`} />
              </RadioGroup>
            </fieldset>
          ))}
        </>
      ) : (
        <Text>No field was changed on both sides: the two versions merge as they are.</Text>
      )}

      <div className={styles.actions}>
        <Button
          className={styles.button}
          size="large"
          appearance="primary"
          onClick={() => onApply(applyChoices(result, choices))}
        >
          Save the merge
        </Button>
        <Button className={styles.button} size="large" appearance="subtle" onClick={onTakeTheirs}>
          Discard my typing and load theirs
        </Button>
      </div>
    </section>
  );
}
