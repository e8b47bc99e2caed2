import { Button, Caption1, makeStyles, mergeClasses, Text, tokens } from '@fluentui/react-components';
import { triggerLevelText } from '@roundbook/domain';
import { roleLabels, TOUCH_TARGET_PX, TriggerLevelBadge } from '@roundbook/ui';
import type { ProjectRole } from '@roundbook/ui';
import { useId, useState } from 'react';
import type { TriggerFiring, TriggerLevel } from '@/features/rounds/api/types';

export interface TriggerPanelProps {
  /** The worst level among the firings, or null when the project has no trigger rules. */
  level: TriggerLevel | null;
  /** Red first, as the server sends them. */
  firings: TriggerFiring[];
  /** How many firings show before the rest fold away (short on a tablet). */
  shownAtFirst?: number;
  /** Worked out from the round as typed (true) or as the server found it at the last save. */
  live?: boolean;
  /** Enabled rules this round lacks the input for: the level is not green until they are in. */
  notEvaluated?: ReadonlyArray<{ summary: string; detail: string }>;
  /** Fired rules held by an engineer's acceptance of a standing condition: listed, not raising the level. */
  accepted?: ReadonlyArray<{ ruleId: string; summary: string; reason: string; acceptedByName: string }>;
}

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalS,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalL}`,
    borderRadius: tokens.borderRadiusLarge,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  red: { borderLeft: `6px solid ${tokens.colorPaletteRedBorderActive}` },
  amber: { borderLeft: `6px solid ${tokens.colorPaletteMarigoldBorderActive}` },
  green: { borderLeft: `6px solid ${tokens.colorPaletteGreenBorderActive}` },
  top: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', columnGap: tokens.spacingHorizontalM },
  title: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold, margin: 0 },
  note: { color: tokens.colorNeutralForeground2, fontSize: tokens.fontSizeBase300 },
  list: { listStyle: 'none', margin: 0, padding: 0, display: 'flex', flexDirection: 'column' },
  firing: {
    display: 'grid',
    gridTemplateColumns: 'auto 1fr',
    columnGap: tokens.spacingHorizontalM,
    alignItems: 'start',
    paddingBlock: tokens.spacingVerticalS,
    borderTop: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  body: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXXS, minWidth: 0 },
  summary: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalM,
    rowGap: tokens.spacingVerticalXXS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground2 },
  detail: { margin: 0 },
  more: { alignSelf: 'flex-start', minHeight: `${TOUCH_TARGET_PX}px` },
});

const roles = Object.keys(roleLabels);

/** "Engineer" for a known project role; the server's word otherwise. */
function ownerOf(role: string): string {
  return roles.includes(role) ? roleLabels[role as ProjectRole] : role;
}

/** Hours as a person on shift says them: "at once", "within 4 h", "within 48 h (2 days)". */
export function formatTimeAllowed(hours: number): string {
  if (hours <= 0) return 'at once';
  const h = Number.isInteger(hours) ? String(hours) : hours.toFixed(1);
  if (hours >= 48 && hours % 24 === 0) return `within ${h} h (${hours / 24} days)`;
  return `within ${h} h`;
}

function Firing({ firing }: { firing: TriggerFiring }) {
  const styles = useStyles();
  return (
    <li className={styles.firing} data-testid="trigger-firing">
      <TriggerLevelBadge level={firing.level} size="large" />
      <div className={styles.body}>
        <Text className={styles.summary}>{firing.summary}</Text>
        <dl className={styles.facts}>
          <dt className={styles.term}>Why it fires</dt>
          <dd className={styles.detail}>{firing.detail}</dd>
          <dt className={styles.term}>What to do</dt>
          <dd className={styles.detail}>{firing.action}</dd>
          <dt className={styles.term}>Who acts</dt>
          <dd
            className={styles.detail}
          >{`${ownerOf(firing.ownerRole)}, ${formatTimeAllowed(firing.timeAllowedHours)}`}</dd>
        </dl>
      </div>
    </li>
  );
}

/**
 * The round's trigger level and the rules that fire: worked out from the round as typed once the project's
 * rules are read (the same assessment the server saves), as the server found them at the last save before.
 * Shown above the sections, so it is in sight whatever the geologist is filling in.
 */
export function TriggerPanel({
  level,
  firings,
  shownAtFirst = 2,
  live = false,
  notEvaluated = [],
  accepted = [],
}: TriggerPanelProps) {
  const styles = useStyles();
  const titleId = useId();
  const listId = useId();
  const [open, setOpen] = useState(false);
  // A new round has no data yet: the rules that wait for it are one line until asked for (issue 19 item 4).
  const [waitingOpen, setWaitingOpen] = useState(false);
  const waitingId = useId();
  const waiting = level === null ? notEvaluated : [];
  const folded = firings.length > shownAtFirst && !open;
  const shown = folded ? firings.slice(0, shownAtFirst) : firings;
  const hidden = firings.length - shownAtFirst;

  const basis = live ? 'As typed; saved with the round.' : 'As of the last save.';
  const note =
    level === null && notEvaluated.length > 0
      ? `${notEvaluated.length} ${notEvaluated.length === 1 ? 'rule waits' : 'rules wait'} for the data they read. ${basis}`
      : level === null
        ? 'The project has no trigger rules yet; an admin or engineer adds them in Setup.'
        : firings.length === 0
          ? `No rule fires on this round. ${basis}`
          : `${firings.length} ${firings.length === 1 ? 'rule fires' : 'rules fire'}, worst first. ${basis}`;

  return (
    <section
      className={mergeClasses(styles.root, level !== null && styles[level])}
      aria-labelledby={titleId}
      data-testid="trigger-panel"
    >
      <div className={styles.top}>
        <h2 id={titleId} className={styles.title}>
          Trigger level
        </h2>
        <TriggerLevelBadge
          level={level}
          noneLabel={triggerLevelText(level, notEvaluated.length)}
          size="extra-large"
        />
        <Caption1 className={styles.note}>{note}</Caption1>
      </div>
      {waiting.length > 0 && (
        <Button
          className={styles.more}
          size="large"
          appearance="secondary"
          aria-expanded={waitingOpen}
          aria-controls={waitingId}
          onClick={() => setWaitingOpen((o) => !o)}
        >
          {waitingOpen ? 'Hide the waiting rules' : 'Show which rules wait'}
        </Button>
      )}
      {waiting.length > 0 && waitingOpen && (
        <ul
          className={styles.list}
          id={waitingId}
          aria-label="Rules waiting for data"
          data-testid="rules-waiting"
        >
          {waiting.map((r, i) => (
            <li key={`${i}-${r.summary}`} className={styles.note}>{`${r.summary} — ${r.detail}`}</li>
          ))}
        </ul>
      )}
      {firings.length > 0 && (
        <ul className={styles.list} id={listId} aria-label="Rules that fire">
          {shown.map((firing) => (
            <Firing key={firing.ruleId} firing={firing} />
          ))}
        </ul>
      )}
      {firings.length > shownAtFirst && (
        <Button
          className={styles.more}
          size="large"
          appearance="secondary"
          aria-expanded={!folded}
          aria-controls={listId}
          onClick={() => setOpen((o) => !o)}
        >
          {folded ? `Show ${hidden} more ${hidden === 1 ? 'rule' : 'rules'}` : 'Show fewer'}
        </Button>
      )}
      {accepted.length > 0 && (
        <ul
          className={styles.list}
          aria-label="Accepted standing conditions"
          data-testid="accepted-conditions"
        >
          {accepted.map((a) => (
            <li key={a.ruleId} className={styles.note}>
              {`Accepted, not raising the level: ${a.summary} — ${a.acceptedByName}: ${a.reason}`}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
