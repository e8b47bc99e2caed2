import {
  Button,
  Card,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Subtitle2,
  Text,
  tokens,
} from '@fluentui/react-components';
import { AddRegular } from '@fluentui/react-icons';
import { formatChainage } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import { useCreateRound, useNextRound } from '@/features/rounds/api/create-round';
import type { HeadingDetail, Round, Stage } from '@/features/rounds/api/types';
import { chainageOf } from '@/features/rounds/schemas/round-form';
import { stageLabels } from '@/features/rounds/utils/labels';

export interface NewRoundPanelProps {
  projectId: string;
  heading: HeadingDetail;
  onCreated: (round: Round) => void;
}

const useStyles = makeStyles({
  panel: {
    padding: tokens.spacingHorizontalXL,
    rowGap: tokens.spacingVerticalL,
    width: '100%',
    maxWidth: '40rem',
  },
  content: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  actions: { display: 'flex', gap: tokens.spacingHorizontalM, justifyContent: 'flex-end' },
  stages: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  stage: { minHeight: '56px', minWidth: '9rem', fontSize: tokens.fontSizeBase400 },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, fontSize: tokens.fontSizeBase500 },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  muted: { color: tokens.colorNeutralForeground2 },
});

/** Opens a new round: a stage, and the face chainage (prefilled from the last round of that stage). */
export function NewRoundPanel({ projectId, heading, onCreated }: NewRoundPanelProps) {
  const styles = useStyles();
  const [open, setOpen] = useState(false);
  const [stage, setStage] = useState<Stage | null>(heading.stages.length === 1 ? heading.stages[0] : null);
  /** What the person typed; null while the suggestion from /next stands. */
  const [typed, setTyped] = useState<string | null>(null);
  const next = useNextRound(projectId, heading.id, open ? stage : null);
  const create = useCreateRound(projectId, heading);
  const style = { style: heading.chainageStyle, decimals: heading.chainageDecimals };

  const face =
    typed ?? (next.data === undefined ? '' : formatChainage(next.data.suggestedFaceChainage, style));
  const chainage = chainageOf(face);
  if (!open) {
    return (
      <Button
        className={styles.button}
        size="large"
        appearance="primary"
        icon={<AddRegular />}
        onClick={() => setOpen(true)}
      >
        New round
      </Button>
    );
  }
  // An inline panel rather than a modal: it stays out of the way of the table and of navigation.
  return (
    <Card className={styles.panel} role="region" aria-label={`New round on ${heading.code}`}>
      <Subtitle2 as="h2">{`New round on ${heading.code}`}</Subtitle2>
      <div className={styles.content}>
        <div role="radiogroup" aria-label="Stage" className={styles.stages}>
          {heading.stages.map((s) => (
            <Button
              key={s}
              role="radio"
              aria-checked={stage === s}
              className={styles.stage}
              appearance={stage === s ? 'primary' : 'secondary'}
              onClick={() => {
                setStage(s);
                setTyped(null);
              }}
            >
              {stageLabels[s]}
            </Button>
          ))}
        </div>
        {next.data !== undefined && (
          <Text className={styles.muted} data-testid="next-round">
            {`Round ${next.data.roundNumber} of this stage. The last face was at ${formatChainage(next.data.previousChainage, style)}; planned round ${next.data.plannedRoundLength} m.`}
            {next.data.allowedRoundLength !== null &&
              next.data.allowedRoundLength < next.data.plannedRoundLength &&
              ` ${next.data.allowedByClassCode ?? 'The last round’s class'} of the last round allows ${next.data.allowedRoundLength} m: the suggested face is that far on.`}
          </Text>
        )}
        <Field
          label="Face chainage"
          size="large"
          hint="as 1+250.0 or 1250.0"
          validationState={face !== '' && chainage === null ? 'error' : 'none'}
          validationMessage={
            face !== '' && chainage === null ? 'Write the chainage as 1+250.0 or 1250.0.' : undefined
          }
        >
          <Input
            className={styles.input}
            size="large"
            inputMode="decimal"
            value={face}
            onChange={(_e, d) => setTyped(d.value)}
          />
        </Field>
        {create.isError && (
          <MessageBar intent="error">
            <MessageBarBody>{create.error.message}</MessageBarBody>
          </MessageBar>
        )}
      </div>
      <div className={styles.actions}>
        <Button className={styles.button} size="large" onClick={() => setOpen(false)}>
          Cancel
        </Button>
        <Button
          className={styles.button}
          size="large"
          appearance="primary"
          disabled={stage === null || chainage === null || create.isPending}
          onClick={() => {
            if (stage === null || chainage === null) return;
            create.mutate(
              { stage, faceChainage: chainage, next: next.data },
              {
                onSuccess: (round) => {
                  setOpen(false);
                  onCreated(round);
                },
              },
            );
          }}
        >
          {create.isPending ? 'Opening…' : 'Open the round'}
        </Button>
      </div>
    </Card>
  );
}
