import { Badge, Card, makeStyles, mergeClasses, Subtitle2, Text, tokens } from '@fluentui/react-components';
import { CheckmarkCircleFilled, ClockRegular, WarningFilled } from '@fluentui/react-icons';
import { formatAzimuth, formatChainageFor } from '@roundbook/domain';
import { TriggerLevelBadge } from '@roundbook/ui';
import type { ReactElement, ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { HandoverSummary, HeadingSummary } from '@/api/contract';
import {
  formatGradient,
  formatProjectTime,
  handoverState,
  stageLabels,
  type HandoverState,
} from '@/features/projects/utils/format';

export interface HeadingCardProps {
  heading: HeadingSummary;
  /** The project's time zone; every time on the card is shown in it. */
  timeZone: string;
  /** Where the card's title leads (the heading's screen). */
  to?: string;
  /** Where the "waiting for review" count leads (the queue, filtered to this heading). */
  reviewTo?: string;
  /** Where the last handover leads (the heading's Handovers tab, newest first). */
  handoversTo?: string;
}

const useStyles = makeStyles({
  card: {
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    borderTop: `${tokens.strokeWidthThickest} solid ${tokens.colorBrandStroke1}`,
  },
  top: {
    display: 'flex',
    alignItems: 'flex-start',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalM,
  },
  titles: { display: 'flex', flexDirection: 'column', minWidth: 0 },
  name: { margin: 0 },
  link: {
    color: tokens.colorBrandForeground1,
    display: 'inline-flex',
    alignItems: 'center',
    minHeight: '48px',
    textDecorationThickness: '2px',
  },
  /**
   * A link among the facts: a 46 px touch target (gloves) from padding that a negative margin takes back, so
   * the text stays on its term's line.
   */
  factLink: {
    color: tokens.colorBrandForeground1,
    display: 'inline-block',
    paddingBlock: '12px',
    marginBlock: '-12px',
    textDecorationThickness: '2px',
  },
  code: {
    fontFamily: tokens.fontFamilyMonospace,
    fontWeight: tokens.fontWeightSemibold,
    color: tokens.colorBrandForeground1,
    letterSpacing: '0.04em',
  },
  face: { display: 'flex', flexDirection: 'column' },
  faceLabel: { color: tokens.colorNeutralForeground2, fontSize: tokens.fontSizeBase400 },
  faceValue: {
    fontSize: tokens.fontSizeHero800,
    lineHeight: tokens.lineHeightHero800,
    fontWeight: tokens.fontWeightBold,
    fontVariantNumeric: 'tabular-nums',
  },
  faceDraft: {
    fontSize: tokens.fontSizeBase300,
    color: tokens.colorNeutralForeground2,
    fontStyle: 'italic',
  },
  faceEmpty: {
    fontSize: tokens.fontSizeBase500,
    lineHeight: tokens.lineHeightBase500,
    fontWeight: tokens.fontWeightSemibold,
    color: tokens.colorNeutralForeground2,
  },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'minmax(9rem, max-content) 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground2, fontSize: tokens.fontSizeBase400 },
  detail: { margin: 0, fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold },
  stages: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
  attention: { color: tokens.colorPaletteDarkOrangeForeground1 },
  handover: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'flex-start',
    rowGap: tokens.spacingVerticalS,
  },
  /** The acknowledgement state: a mark of its own shape and its word, the colour only a third cue. */
  handoverLine: {
    display: 'inline-flex',
    alignItems: 'flex-start',
    columnGap: tokens.spacingHorizontalS,
    fontWeight: tokens.fontWeightSemibold,
  },
  handoverMark: { fontSize: '20px', flexShrink: 0, marginTop: '1px' },
  acknowledged: { color: tokens.colorPaletteGreenForeground1 },
  waiting: { color: tokens.colorPaletteDarkOrangeForeground1 },
  overdue: { color: tokens.colorPaletteRedForeground1 },
});

type ShownHandoverState = Exclude<HandoverState, 'none'>;

/** A check in a circle, a clock, a warning triangle: three shapes for the three states. */
const handoverMarks: Record<ShownHandoverState, ReactElement> = {
  acknowledged: <CheckmarkCircleFilled />,
  waiting: <ClockRegular />,
  overdue: <WarningFilled />,
};

function handoverWords(state: ShownHandoverState, h: HandoverSummary, timeZone: string): string {
  switch (state) {
    case 'acknowledged':
      return `Acknowledged ${formatProjectTime(h.acknowledgedAt ?? h.sentAt, timeZone)}`;
    case 'waiting':
      return `Waiting for acknowledgement, due by ${formatProjectTime(h.ackDueAt, timeZone)}`;
    case 'overdue':
      return `Overdue: not acknowledged, was due by ${formatProjectTime(h.ackDueAt, timeZone)}`;
  }
}

function LastHandover({
  handover,
  timeZone,
  to,
}: {
  handover: HandoverSummary;
  timeZone: string;
  to?: string;
}) {
  const styles = useStyles();
  const state = handoverState(handover);
  if (state === 'none') return null;
  const sent = `sent ${formatProjectTime(handover.sentAt, timeZone)}`;
  return (
    <span className={styles.handover}>
      {to === undefined ? (
        sent
      ) : (
        <Link className={styles.factLink} to={to}>
          {sent}
        </Link>
      )}
      <span
        className={mergeClasses(styles.handoverLine, styles[state])}
        data-testid="handover-state"
        data-state={state}
      >
        <span className={styles.handoverMark} aria-hidden="true">
          {handoverMarks[state]}
        </span>
        <span>{handoverWords(state, handover, timeZone)}</span>
      </span>
    </span>
  );
}

function Fact({ term, children }: { term: string; children: ReactNode }) {
  const styles = useStyles();
  return (
    <>
      <dt className={styles.term}>{term}</dt>
      <dd className={styles.detail}>{children}</dd>
    </>
  );
}

/** One heading on the Board: where the face is and what is waiting on it. */
export function HeadingCard({ heading, timeZone, to, reviewTo, handoversTo }: HeadingCardProps) {
  const styles = useStyles();
  const handover = heading.lastHandover;
  const titleId = `heading-${heading.id}-title`;

  return (
    <Card className={styles.card} role="article" aria-labelledby={titleId} data-testid="heading-card">
      <div className={styles.top}>
        <div className={styles.titles}>
          <Text className={styles.code}>{heading.code}</Text>
          <Subtitle2 as="h3" id={titleId} className={styles.name}>
            {to === undefined ? (
              heading.name
            ) : (
              <Link className={styles.link} to={to}>
                {heading.name}
              </Link>
            )}
          </Subtitle2>
        </div>
        <TriggerLevelBadge
          level={heading.triggerLevel}
          prefix="Trigger: "
          noneLabel="No trigger level yet"
          size="extra-large"
        />
      </div>

      <div className={styles.face}>
        <Text className={styles.faceLabel}>Face chainage</Text>
        {heading.faceChainage === null ? (
          <Text className={styles.faceEmpty}>
            {heading.draftFaceChainage === null
              ? `no rounds yet (starts at ${formatChainageFor(heading.startChainage, heading)})`
              : `none handed in yet (starts at ${formatChainageFor(heading.startChainage, heading)})`}
          </Text>
        ) : (
          <Text className={styles.faceValue}>{formatChainageFor(heading.faceChainage, heading)}</Text>
        )}
        {heading.draftFaceChainage !== null && (
          <Text className={styles.faceDraft}>
            {`Draft at ${formatChainageFor(heading.draftFaceChainage, heading)}, not yet submitted`}
          </Text>
        )}
      </div>

      <dl className={styles.facts}>
        <Fact term="Drive direction">
          {`${formatAzimuth(heading.driveTrend, 1)}, ${formatGradient(heading.gradientPercent)}`}
        </Fact>
        <Fact term="Stages">
          {heading.stages.length === 0 ? (
            '—'
          ) : (
            <span className={styles.stages}>
              {heading.stages.map((stage) => (
                <Badge key={stage} appearance="tint" color="brand" shape="rounded" size="large">
                  {stageLabels[stage]}
                </Badge>
              ))}
            </span>
          )}
        </Fact>
        <Fact term="Last round">
          {heading.lastRoundAt === null ? 'none yet' : formatProjectTime(heading.lastRoundAt, timeZone)}
        </Fact>
        <Fact term="Support class">
          {heading.confirmedClass ? (
            <span data-testid="confirmed-class">
              {`${heading.confirmedClass.code}, confirmed on round ${heading.confirmedClass.roundNumber} (${stageLabels[heading.confirmedClass.stage].toLowerCase()})`}
            </span>
          ) : (
            'none confirmed yet'
          )}
        </Fact>
        <Fact term="Waiting for review">
          {heading.roundsToConfirm > 0 && reviewTo ? (
            <Link className={mergeClasses(styles.factLink, styles.attention)} to={reviewTo}>
              {`${heading.roundsToConfirm} ${heading.roundsToConfirm === 1 ? 'round' : 'rounds'}`}
            </Link>
          ) : (
            <span className={heading.roundsToConfirm > 0 ? styles.attention : undefined}>
              {heading.roundsToConfirm === 0
                ? 'none'
                : `${heading.roundsToConfirm} ${heading.roundsToConfirm === 1 ? 'round' : 'rounds'}`}
            </span>
          )}
        </Fact>
        <Fact term="Support as built">
          {heading.supportOutstanding ? (
            <span className={styles.attention} data-testid="support-outstanding">
              outstanding on the last confirmed round
            </span>
          ) : (
            'nothing outstanding'
          )}
        </Fact>
        <Fact term="Last handover">
          {handover === null ? (
            'none yet'
          ) : (
            <LastHandover handover={handover} timeZone={timeZone} to={handoversTo} />
          )}
        </Fact>
      </dl>
    </Card>
  );
}
