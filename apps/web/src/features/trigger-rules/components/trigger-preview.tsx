import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  tokens,
} from '@fluentui/react-components';
import { formatChainage } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { TriggerLevel } from '@/api/contract';
import type { TriggerPreview } from '@/features/trigger-rules/api/trigger-rules';
import { LevelBadge } from '@/features/trigger-rules/components/level-badge';

/** Rows shown before "Show all": enough to judge the rule without a long page. */
const FIRST_ROWS = 10;

/** How a round's place is written; Setup passes the headings' own chainage formats and stage names. */
export interface RoundPlaceFormat {
  chainage: (headingCode: string, metres: number) => string;
  stage: (stage: string) => string;
}

/** Without the headings at hand: km + m with one decimal, and "full-face" written as "Full face". */
export const plainPlaceFormat: RoundPlaceFormat = {
  chainage: (_code, metres) => formatChainage(metres, { style: 'km+m', decimals: 1 }),
  stage: (stage) => {
    const words = stage.replace(/-/g, ' ');
    return words.charAt(0).toUpperCase() + words.slice(1);
  },
};

export interface TriggerPreviewResultProps {
  placeFormat?: RoundPlaceFormat;
  result: TriggerPreview;
  /** The level of the rule as it was tried. */
  level: TriggerLevel;
  /** True when the form has changed since the rule was tried. */
  outdated: boolean;
}

const useStyles = makeStyles({
  region: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  heading: { margin: 0 },
  summary: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', columnGap: tokens.spacingHorizontalS },
  wrap: { overflowX: 'auto' },
  nowrap: { whiteSpace: 'nowrap' },
  muted: { color: tokens.colorNeutralForeground2 },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, alignSelf: 'flex-start' },
});

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

function Outcome({ result, level }: { result: TriggerPreview; level: TriggerLevel }) {
  const styles = useStyles();
  const checked = `Checked ${plural(result.evaluatedRounds, 'round')}, the latest of each heading (up to 50 each).`;
  // Some rounds lack what the rule reads (a draft just opened, say): say so beside the outcome on the others,
  // and alone only when none could be tried (a browser run found the outcome hidden by one empty draft).
  const partly =
    result.notEvaluated !== null ? (
      <MessageBar intent="info" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>Not tried on every round</MessageBarTitle>
          {result.notEvaluated}
        </MessageBarBody>
      </MessageBar>
    ) : null;
  if (result.notEvaluated !== null && result.evaluatedRounds === 0) {
    return (
      <MessageBar intent="info" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>Cannot be tried yet</MessageBarTitle>
          {result.notEvaluated}
        </MessageBarBody>
      </MessageBar>
    );
  }
  if (result.evaluatedRounds === 0) {
    return (
      <MessageBar intent="info" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>No rounds to try it on</MessageBarTitle>
          No rounds are recorded on the project&apos;s headings yet.
        </MessageBarBody>
      </MessageBar>
    );
  }
  if (result.matches.length === 0) {
    return (
      <>
        <MessageBar intent="success" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Would not have fired</MessageBarTitle>
            {checked}
          </MessageBarBody>
        </MessageBar>
        {partly}
      </>
    );
  }
  return (
    <>
      <div className={styles.summary} data-testid="trigger-preview-summary">
        <LevelBadge level={level} />
        <Text weight="semibold">
          {`Would have fired on ${plural(result.matches.length, 'round')} of ${result.evaluatedRounds}.`}
        </Text>
        <Text className={styles.muted}>{checked}</Text>
      </div>
      {partly}
    </>
  );
}

/** What trying a rule on the recent rounds found: the count checked and where it would have fired. */
export function TriggerPreviewResult({
  placeFormat = plainPlaceFormat,
  result,
  level,
  outdated,
}: TriggerPreviewResultProps) {
  const styles = useStyles();
  const [showAll, setShowAll] = useState(false);
  const rows = showAll ? result.matches : result.matches.slice(0, FIRST_ROWS);

  return (
    <section className={styles.region} aria-label="Tried on recent rounds" data-testid="trigger-preview">
      <Subtitle2 as="h3" className={styles.heading}>
        Tried on recent rounds (nothing saved)
      </Subtitle2>
      {outdated && (
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            The rule has changed since this try. Try it again to see the new result.
          </MessageBarBody>
        </MessageBar>
      )}
      <Outcome result={result} level={level} />
      {result.matches.length > 0 && (
        <>
          <div className={styles.wrap}>
            <Table size="small" aria-label="Rounds where the rule would have fired">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Heading</TableHeaderCell>
                  <TableHeaderCell>Round</TableHeaderCell>
                  <TableHeaderCell>Face</TableHeaderCell>
                  <TableHeaderCell>Shift date</TableHeaderCell>
                  <TableHeaderCell>Why it fires</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {rows.map((m) => (
                  <TableRow key={m.roundId}>
                    <TableCell>
                      <Text weight="semibold">{m.headingCode}</Text>
                    </TableCell>
                    <TableCell
                      className={styles.nowrap}
                    >{`#${m.roundNumber} · ${placeFormat.stage(m.stage)}`}</TableCell>
                    <TableCell className={styles.nowrap}>
                      {placeFormat.chainage(m.headingCode, m.faceChainage)}
                    </TableCell>
                    <TableCell className={styles.nowrap}>{m.shiftDate}</TableCell>
                    <TableCell>{m.detail}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </div>
          {result.matches.length > FIRST_ROWS && (
            <Button className={styles.button} size="large" onClick={() => setShowAll((v) => !v)}>
              {showAll ? `Show the first ${FIRST_ROWS} only` : `Show all ${result.matches.length}`}
            </Button>
          )}
        </>
      )}
    </section>
  );
}

/** The busy state of a try, below the form while the API works. */
export function TriggerPreviewWaiting() {
  return <Spinner size="small" labelPosition="after" label="Trying the rule on recent rounds…" />;
}
