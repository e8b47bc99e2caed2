import { makeStyles, Text, tokens } from '@fluentui/react-components';
import {
  cycleStageLabels,
  formatChainageFor,
  roundsAheadLabel,
  formatHazardRange,
  hazardKindLabels,
  roleLabel,
  stageLabels,
} from '@roundbook/domain';
import { TriggerLevelBadge } from '@roundbook/ui';
import type { HandoverDraft } from '@/features/handovers/api/handovers';

type DraftHeading = HandoverDraft['headings'][number];

const useStyles = makeStyles({
  facts: { margin: `${tokens.spacingVerticalXS} 0`, paddingLeft: '20px', rowGap: tokens.spacingVerticalXS },
  group: {
    marginTop: tokens.spacingVerticalS,
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalXS,
  },
  groupTitle: { fontWeight: tokens.fontWeightSemibold },
  items: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '6px',
  },
  item: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', columnGap: tokens.spacingHorizontalS },
});

export interface HeadingFactsProps {
  /** The heading as the draft or the sent handover gives it */
  h: DraftHeading;
  /** Where the cycle stands, once the outgoing supervisor said it (a sent handover) */
  cycle?: DraftHeading['cycleStage'];
}

/**
 * What the incoming supervisor needs of one heading before entering it: the face, the last confirmed round,
 * open hazards (level, kind, chainage range, description), support outstanding, and the trigger alerts with
 * who owns them.
 */
export function HeadingFacts({ h, cycle }: HeadingFactsProps) {
  const styles = useStyles();
  const chainage = (m: number) => formatChainageFor(m, h);
  const c = h.lastConfirmed;
  return (
    <div>
      <ul className={styles.facts}>
        <li>
          {h.faceChainage === null
            ? 'Face: no round handed in yet'
            : `Face ${chainage(h.faceChainage)}${h.stage ? `, ${stageLabels[h.stage]}` : ''}`}
        </li>
        {cycle !== undefined && <li>{`Cycle: ${cycle ? cycleStageLabels[cycle] : 'not given'}`}</li>}
        <li>
          {c
            ? `Last confirmed: round ${c.roundNumber} at ${chainage(c.faceChainage)}, class ${c.classCode ?? '—'}` +
              `, next round ${c.nextRoundLength ?? '—'} m`
            : 'No round confirmed yet'}
        </li>
      </ul>
      <section className={styles.group} aria-label={`Open hazards at ${h.code}`}>
        <Text className={styles.groupTitle}>{`Open hazards (${h.hazards.length})`}</Text>
        {h.hazards.length === 0 ? (
          <Text as="p">No open hazards</Text>
        ) : (
          <ul className={styles.items}>
            {h.hazards.map((z) => (
              <li key={z.id} className={styles.item} data-testid="handover-hazard">
                <TriggerLevelBadge level={z.level} size="large" />
                <Text>{`${hazardKindLabels[z.kind]}, ${formatHazardRange(z, h)} — ${z.description}`}</Text>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className={styles.group} aria-label={`Support outstanding at ${h.code}`}>
        <Text className={styles.groupTitle}>Support outstanding</Text>
        {h.supportOutstanding.length === 0 ? (
          <Text as="p">None recorded</Text>
        ) : (
          <ul className={styles.items}>
            {h.supportOutstanding.map((line, i) => (
              <li key={i} data-testid="handover-support-outstanding">
                {line}
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className={styles.group} aria-label={`Look-ahead at ${h.code}`}>
        <Text className={styles.groupTitle}>Look-ahead: mapped features ahead of the face</Text>
        {h.lookAhead.length === 0 ? (
          <Text as="p">None reaching the crown or invert ahead of the face</Text>
        ) : (
          <ul className={styles.items}>
            {h.lookAhead.map((f, i) => (
              <li key={i} data-testid="handover-look-ahead">
                {`${f.label} (round ${f.roundNumber}): reaches the ${f.firstAt} ${f.nearestAhead.toFixed(1)} m ahead, ${roundsAheadLabel(f.roundsAhead)}` +
                  ` — crown ${f.crownChainage === null ? 'runs along' : chainage(f.crownChainage)}, invert ${f.invertChainage === null ? 'runs along' : chainage(f.invertChainage)}` +
                  (f.traceKnown ? '' : ' (from the face centre)')}
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className={styles.group} aria-label={`Trigger alerts at ${h.code}`}>
        <Text className={styles.groupTitle}>Trigger alerts</Text>
        {h.alerts.length === 0 ? (
          <Text as="p">{h.triggerLevel ? 'No alert active' : 'No trigger level worked out yet'}</Text>
        ) : (
          <ul className={styles.items}>
            {h.alerts.map((a, i) => (
              <li key={i} className={styles.item} data-testid="handover-alert">
                <TriggerLevelBadge level={a.level} size="large" />
                <Text>{`${a.summary} — ${a.action} (owner: ${roleLabel(a.ownerRole)})`}</Text>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
