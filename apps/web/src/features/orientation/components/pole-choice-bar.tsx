import { Button, Field, Input, makeStyles, Select, Text, tokens } from '@fluentui/react-components';
import { ArrowExportRegular, DismissRegular, TagRegular } from '@fluentui/react-icons';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';

/** The choice "a new set" in the set picker (no set label can be this: labels are trimmed words). */
const NEW_SET = ' new';

export interface PoleChoiceBarProps {
  /** How many poles are chosen. */
  count: number;
  /** The round's set labels, in their order (S1, S2, …). */
  labels: readonly string[];
  /** Put the chosen poles in this set (a label of `labels` or a new one). */
  onPut: (label: string) => void;
  /** Take the chosen poles out of whatever set they are in (random). */
  onTakeOut: () => void;
  onClear: () => void;
}

/** The next free label of the S1, S2, … series. */
export function nextSetLabel(labels: readonly string[]): string {
  let n = 0;
  for (const l of labels) {
    const m = /^S(\d+)$/.exec(l);
    if (m) n = Math.max(n, Number(m[1]));
  }
  return `S${n + 1}`;
}

const useStyles = makeStyles({
  bar: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    gap: tokens.spacingHorizontalM,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusLarge,
    border: `${tokens.strokeWidthThick} solid ${tokens.colorBrandStroke1}`,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  count: {
    fontWeight: tokens.fontWeightSemibold,
    minHeight: `${TOUCH_TARGET_PX}px`,
    display: 'inline-flex',
    alignItems: 'center',
  },
  big: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  select: { minWidth: '9rem', '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  name: { width: '8rem' },
});

/**
 * What to do with the poles chosen on the net: put them in a set of the round (or a new one) or take them
 * out of their set. Either is the geologist's own choice, kept over the computed sets.
 */
export function PoleChoiceBar({ count, labels, onPut, onTakeOut, onClear }: PoleChoiceBarProps) {
  const styles = useStyles();
  const [target, setTarget] = useState<string>(labels[0] ?? NEW_SET);
  const [name, setName] = useState(() => nextSetLabel(labels));
  // A label that went away (its last pole moved) falls back to the first one.
  const picked = target === NEW_SET || labels.includes(target) ? target : (labels[0] ?? NEW_SET);
  const label = picked === NEW_SET ? name.trim() : picked;
  const none = count === 0;
  return (
    <div className={styles.bar} role="group" aria-label="Chosen poles">
      <Text className={styles.count} aria-live="polite">
        {`${count} pole${count === 1 ? '' : 's'} selected`}
      </Text>
      <Field label="Set to put them in">
        <Select
          className={styles.select}
          size="large"
          value={picked}
          onChange={(_, d) => {
            setTarget(d.value);
            if (d.value === NEW_SET) setName(nextSetLabel(labels));
          }}
        >
          {labels.map((l) => (
            <option key={l} value={l}>
              {l}
            </option>
          ))}
          <option value={NEW_SET}>A new set…</option>
        </Select>
      </Field>
      {picked === NEW_SET && (
        <Field
          label="Name of the new set"
          validationState={label === '' ? 'error' : 'none'}
          validationMessage={label === '' ? 'Give the set a name' : undefined}
        >
          <Input
            className={styles.name}
            size="large"
            value={name}
            maxLength={20}
            onChange={(_, d) => setName(d.value)}
          />
        </Field>
      )}
      <Button
        className={styles.big}
        size="large"
        appearance="primary"
        icon={<TagRegular />}
        disabled={none || label === ''}
        onClick={() => onPut(label)}
      >
        {label === '' ? 'Put in set' : `Put in set ${label}`}
      </Button>
      <Button
        className={styles.big}
        size="large"
        icon={<ArrowExportRegular />}
        disabled={none}
        onClick={onTakeOut}
      >
        Take out of its set
      </Button>
      <Button className={styles.big} size="large" icon={<DismissRegular />} disabled={none} onClick={onClear}>
        Clear
      </Button>
    </div>
  );
}
