import { Caption1, Field, makeStyles, Select, tokens } from '@fluentui/react-components';
import {
  SAME_FEATURE_TOLERANCE_DEG,
  SAME_FEATURE_WITHIN_M,
  sameFeatureCandidates,
  type OfferedFeature,
} from '@roundbook/domain';
import { formatPlane, type Plane } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useNearbyJoints } from '@/features/rounds/api/get-round';
import { jointKindLabels } from '@/features/rounds/utils/labels';

/** Where the round is: what the picker reads the earlier rounds of the heading around. */
export interface FeatureSource {
  projectId: string;
  headingId: string;
  roundId: string;
  faceChainage: number;
  /** Chainage in the heading's style (2+483.0) */
  chainage: (metres: number) => string;
}

export interface SameFeaturePickerProps {
  /** 1, 2, … (the joint's number on this face, for the accessible name) */
  jointNumber: number;
  /** The joint's orientation as read; null: offered by chainage only. */
  plane: Plane | null;
  /** The feature it is linked to: the id of its first observation ('' = not linked). */
  value: string;
  onChange: (firstObservationId: string) => void;
  source: FeatureSource;
  readOnly: boolean;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXXS, minWidth: 0 },
  select: { minWidth: 0, '& select': { minHeight: `${TOUCH_TARGET_PX}px` } },
  muted: { color: tokens.colorNeutralForeground2 },
});

/** The feature's key: a pick of a later observation stands for the first one (as the API stores it). */
const keyOf = (o: OfferedFeature) => o.candidate.sameAsJointId ?? o.candidate.id;

function optionText(o: OfferedFeature, chainage: (m: number) => string): string {
  const c = o.candidate;
  const kind = jointKindLabels[c.kind as keyof typeof jointKindLabels] ?? c.kind;
  const words = [
    `Round ${c.roundNumber} at ${chainage(c.faceChainage)}`,
    `${kind.toLowerCase()} ${formatPlane(c, 'dip-direction/dip')}`,
    ...(o.angle === null ? [] : [`${Math.round(o.angle)}° apart`]),
    ...(c.notes ? [c.notes.length > 40 ? `${c.notes.slice(0, 39)}…` : c.notes] : []),
  ];
  return words.join(' · ');
}

/**
 * "Same feature as": links a joint to a feature mapped on an earlier round of the heading, so the feature
 * is counted once over a stretch of tunnel. Offered: earlier rounds within SAME_FEATURE_WITHIN_M of this
 * face and SAME_FEATURE_TOLERANCE_DEG of this orientation, one line per feature (packages/domain
 * sameFeatureCandidates). The geologist decides; nothing is linked without a pick.
 */
export function SameFeaturePicker({
  jointNumber,
  plane,
  value,
  onChange,
  source,
  readOnly,
}: SameFeaturePickerProps) {
  const styles = useStyles();
  const nearby = useNearbyJoints(
    source.projectId,
    source.headingId,
    {
      fromChainage: source.faceChainage - SAME_FEATURE_WITHIN_M,
      toChainage: source.faceChainage + SAME_FEATURE_WITHIN_M,
      excludeRoundId: source.roundId,
    },
    true,
  );
  const offered = sameFeatureCandidates(nearby.data ?? [], {
    plane,
    faceChainage: source.faceChainage,
    roundId: source.roundId,
  });
  const linkedShown = value === '' || offered.some((o) => keyOf(o) === value);
  // The linked feature itself, when today's offer leaves it out (the orientation was changed since).
  const linked = linkedShown
    ? null
    : (nearby.data ?? []).find((c) => c.id === value || c.sameAsJointId === value);
  const hint = nearby.isLoading
    ? 'Reading the earlier rounds…'
    : nearby.error
      ? `The earlier rounds could not be read: ${nearby.error.message}`
      : offered.length === 0
        ? `No feature of an earlier round within ${SAME_FEATURE_WITHIN_M} m and ${SAME_FEATURE_TOLERANCE_DEG}° of this orientation.`
        : `Earlier rounds within ${SAME_FEATURE_WITHIN_M} m and ${SAME_FEATURE_TOLERANCE_DEG}° of this orientation; a linked feature counts once over the heading.`;
  return (
    <div className={styles.root}>
      <Field label="Same feature as" size="small">
        <Select
          className={styles.select}
          aria-label={`Same feature as, joint ${jointNumber}`}
          value={value}
          size="large"
          disabled={readOnly}
          onChange={(_e, data) => onChange(data.value)}
        >
          <option value="">Not linked (a feature of its own)</option>
          {!linkedShown && (
            <option value={value}>
              {linked
                ? `Linked: round ${linked.roundNumber} at ${source.chainage(linked.faceChainage)} (outside today's offer)`
                : 'Linked to a feature of an earlier round'}
            </option>
          )}
          {offered.map((o) => (
            <option key={keyOf(o)} value={keyOf(o)}>
              {optionText(o, source.chainage)}
            </option>
          ))}
        </Select>
      </Field>
      <Caption1 className={styles.muted} role={nearby.error ? 'alert' : undefined}>
        {hint}
      </Caption1>
    </div>
  );
}
