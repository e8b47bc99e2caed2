import {
  Badge,
  Button,
  Caption1,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Text,
  tokens,
} from '@fluentui/react-components';
import { SendRegular } from '@fluentui/react-icons';
import { qBandText, rmrBandText, type SupportSuggestion } from '@roundbook/domain';
import { ratingCaution } from '@roundbook/geomath';
import { useFormikContext } from 'formik';
import type { SupportClass } from '@/features/rounds/api/types';
import { NumberField, TextField, useRoundEdit } from '@/features/rounds/components/round-fields';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { valueOf } from '@/features/rounds/schemas/round-form';

export interface SupportSectionProps {
  classes: SupportClass[];
  suggestedClassIds: string[];
  /**
   * What the ratings point to and why (the round's assessment): its reason is shown, and when no class fits
   * both ratings the more cautious class it names is offered first.
   */
  suggestion?: Pick<SupportSuggestion, 'suggested' | 'reason'>;
  /** The heading's planned round length: the next round length starts at it, or at the class's maximum if less */
  plannedRoundLength?: number;
  canSubmit: boolean;
  submitting: boolean;
  submitMessage: string | null;
  onSubmit: () => void;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  // Each heading stands apart from the cards above it (issue 19 item 5: two headings ran together).
  classes: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalM },
  heading: { margin: 0, marginTop: tokens.spacingVerticalS },
  list: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(17rem, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  card: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'stretch',
    rowGap: tokens.spacingVerticalXS,
    textAlign: 'left',
    minHeight: '7rem',
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThick} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusXLarge,
    backgroundColor: tokens.colorNeutralBackground1,
    color: tokens.colorNeutralForeground1,
    cursor: 'pointer',
    font: 'inherit',
    ':disabled': { cursor: 'default' },
  },
  suggested: {
    borderTopColor: tokens.colorPaletteGreenBorder2,
    borderRightColor: tokens.colorPaletteGreenBorder2,
    borderBottomColor: tokens.colorPaletteGreenBorder2,
    borderLeftColor: tokens.colorPaletteGreenBorder2,
  },
  chosen: {
    backgroundColor: tokens.colorBrandBackground2,
    outline: `${tokens.strokeWidthThickest} solid ${tokens.colorBrandStroke1}`,
  },
  top: {
    display: 'flex',
    justifyContent: 'space-between',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
  },
  code: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightBold },
  muted: { color: tokens.colorNeutralForeground2 },
  fields: {
    display: 'grid',
    gridTemplateColumns: 'minmax(14rem, 1fr) 2fr',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  submit: {
    minHeight: '56px',
    fontSize: tokens.fontSizeBase500,
    alignSelf: 'flex-start',
    paddingInline: tokens.spacingHorizontalXXL,
  },
  error: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
});

/** A class in two lines of words: its bands and round length, then what is built (cards and summaries). */
export function classLines(c: SupportClass): string[] {
  const bands = [
    // The bands exactly as they are applied (Q half-open, RMR89 both ends included; packages/domain).
    qBandText(c),
    rmrBandText(c),
    `rounds up to ${c.maxRoundLength} m`,
  ]
    .filter((s) => s !== null)
    .join(' · ');
  const build = [
    c.boltType && `${c.boltType}${c.boltLength ? ` ${c.boltLength} m` : ''} ${c.boltPattern}`.trim(),
    c.shotcreteMm > 0 ? `${c.shotcreteMm} mm sprayed concrete` : null,
    c.steelSupport || null,
    c.probingRequired ? 'probe ahead' : null,
  ]
    .filter((s) => s)
    .join(' · ');
  return [bands, build].filter((line) => line !== '');
}

/** The recommendation: a support class (suggested ones first), the next round length, a reason, submit. */
export function SupportSection({
  classes,
  suggestedClassIds,
  suggestion,
  plannedRoundLength,
  canSubmit,
  submitting,
  submitMessage,
  onSubmit,
}: SupportSectionProps) {
  const styles = useStyles();
  const { values, setFieldValue } = useFormikContext<RoundFormValues>();
  const { readOnly, serverErrors } = useRoundEdit();
  const active = classes.filter((c) => !c.retired);
  const suggested = suggestedClassIds
    .map((id) => active.find((c) => c.id === id))
    .filter((c): c is SupportClass => c !== undefined);
  // No class fits both ratings: the more cautious of the two the ratings point to comes first, with the reason.
  const cautious =
    suggested.length === 0 && suggestion?.suggested
      ? (active.find((c) => c.id === suggestion.suggested) ?? null)
      : null;
  const others = active
    .filter((c) => !suggestedClassIds.includes(c.id) && c.id !== cautious?.id)
    .sort((a, b) => a.sortOrder - b.sortOrder);
  const chosen = active.find((c) => c.id === values.recommendedClassId) ?? null;
  const outside = chosen !== null && !suggestedClassIds.includes(chosen.id);
  const next = valueOf(values.nextRoundLength);
  const overMax = chosen !== null && next !== null && next > chosen.maxRoundLength;
  const caution = ratingCaution('who-decides');

  const card = (c: SupportClass, isSuggested: boolean, badge = 'Fits the ratings') => (
    <button
      key={c.id}
      type="button"
      role="radio"
      aria-checked={values.recommendedClassId === c.id}
      className={mergeClasses(
        styles.card,
        isSuggested && styles.suggested,
        values.recommendedClassId === c.id && styles.chosen,
      )}
      disabled={readOnly}
      data-testid="support-class"
      onClick={() => {
        void setFieldValue('recommendedClassId', c.id);
        // The heading's planned length, unless the class allows less (issue 19 item 2).
        if (values.nextRoundLength === '')
          void setFieldValue(
            'nextRoundLength',
            String(
              plannedRoundLength === undefined
                ? c.maxRoundLength
                : Math.min(plannedRoundLength, c.maxRoundLength),
            ),
          );
      }}
    >
      <span className={styles.top}>
        <span className={styles.code}>{c.code}</span>
        {isSuggested && (
          <Badge appearance="filled" color="success" size="large" shape="rounded">
            {badge}
          </Badge>
        )}
      </span>
      <Text weight="semibold">{c.name}</Text>
      {classLines(c).map((line) => (
        <Caption1 key={line} className={styles.muted}>
          {line}
        </Caption1>
      ))}
    </button>
  );

  return (
    <section className={styles.root} aria-label="Support">
      <MessageBar intent="warning" layout="multiline" data-testid="support-caution">
        <MessageBarBody>
          <MessageBarTitle>{caution.title}</MessageBarTitle>
          {caution.text}
        </MessageBarBody>
      </MessageBar>

      <div role="radiogroup" aria-label="Support class recommended" className={styles.classes}>
        <Text as="h3" weight="semibold" size={500} className={styles.heading}>
          {suggested.length > 0 ? 'Classes that fit the ratings' : 'No class fits the ratings as saved'}
        </Text>
        {suggestion?.reason ? (
          <Text className={styles.muted} data-testid="support-reason">
            {suggestion.reason}
          </Text>
        ) : null}
        {suggested.length > 0 && <div className={styles.list}>{suggested.map((c) => card(c, true))}</div>}
        {cautious !== null && (
          <div className={styles.list}>{card(cautious, true, 'The more cautious of the two')}</div>
        )}
        <Text as="h3" weight="semibold" size={500} className={styles.heading}>
          Other active classes
        </Text>
        <div className={styles.list}>{others.map((c) => card(c, false))}</div>
        {serverErrors.recommendedClassId !== undefined && (
          <Text className={styles.error} role="alert" data-testid="class-error">
            {serverErrors.recommendedClassId}
          </Text>
        )}
      </div>

      <div className={styles.fields}>
        <NumberField
          name="nextRoundLength"
          label="Next round length"
          unit="m"
          hint={chosen === null ? undefined : `${chosen.code} allows up to ${chosen.maxRoundLength} m`}
          warning={
            overMax && chosen !== null ? `Over the ${chosen.maxRoundLength} m ${chosen.code} allows.` : null
          }
        />
        <TextField
          name="recommendationReason"
          label={outside ? 'Why this class (it is outside the suggestion)' : 'Reason or remarks'}
          hint={outside ? 'needed when the class is not one the ratings suggest' : undefined}
          multiline
        />
      </div>

      {canSubmit && (
        <>
          {submitMessage !== null && (
            <MessageBar intent="error" data-testid="submit-error">
              <MessageBarBody>{submitMessage}</MessageBarBody>
            </MessageBar>
          )}
          <Button
            className={styles.submit}
            appearance="primary"
            size="large"
            icon={<SendRegular />}
            disabled={submitting}
            onClick={onSubmit}
          >
            {submitting ? 'Submitting…' : 'Submit for review'}
          </Button>
          <Caption1 className={styles.muted}>
            Submitting sends the round to the project's engineers; it can no longer be edited here.
          </Caption1>
        </>
      )}
    </section>
  );
}
