import { Caption1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import type { FeatureAssessment, JointKind, RoundSets } from '@roundbook/domain';
import { jointKindLabels } from '@roundbook/domain';
import type { Drive } from '@roundbook/geomath';
import { useMemo } from 'react';
import { DEFAULT_FRICTION_ANGLE, OrientationView } from '@/features/orientation/components/orientation-view';
import type { ViewJoint, ViewSet } from '@/features/orientation/components/orientation-view';
import { RoofWedgeList } from '@/features/orientation/components/roof-wedge-list';

/** A joint of the round as the record or the assessment has it (JointDto and AssessedJoint both fit). */
export interface PanelJoint {
  id: string;
  kind: JointKind;
  dipDirection: number | null;
  dip: number | null;
  /** Position on the round (1, 2, …). */
  seq?: number;
  /** The orientation as typed. */
  orientationText?: string;
}

export interface RoundOrientationPanelProps {
  /** The round's joints; those whose orientation cannot be read are counted, not plotted. */
  joints: readonly PanelJoint[];
  /** The sets of the round's assessment (assessRound(…).sets): labels, means, k, α95, membership. */
  sets: Pick<RoundSets, 'sets' | 'membership'>;
  /** Significant single features judged on their own (assessRound(…).features), if any. */
  features?: readonly FeatureAssessment[];
  /** The drive at the round's face (tunnel axis and direction of advance), or null when unknown. */
  drive: Drive | null;
  highContrast: boolean;
  /** Base of the downloaded file's name, e.g. "HR-U-round-84". */
  fileName: string;
  /**
   * Put joints (by id) in a set, or take them out of theirs (null), as the geologist's own choice; given
   * for an editable draft only (a read-only round shows no choosing of poles).
   */
  onAssign?: ((ids: string[], label: string | null) => void) | null;
  /** Friction angle of the joints for the friction circle and the roof wedges, degrees (default 30). */
  frictionAngle?: number;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  note: { color: tokens.colorNeutralForeground2 },
});

/**
 * A round's orientation panel: its joints on the stereonet with the round's own sets (from the
 * assessment, overrides included), each set's mean and α95 cone, the tunnel axis, the drive and the
 * adverse zone; tap a pole to read it in every notation. On an editable round, poles chosen by tap or
 * lasso can be put in a set or taken out of one.
 */
export function RoundOrientationPanel({
  joints,
  sets,
  features = [],
  drive,
  highContrast,
  fileName,
  onAssign = null,
  frictionAngle = DEFAULT_FRICTION_ANGLE,
}: RoundOrientationPanelProps) {
  const styles = useStyles();
  const readable = useMemo(
    () =>
      joints.filter(
        (j): j is PanelJoint & { dipDirection: number; dip: number } =>
          j.dipDirection !== null && j.dip !== null,
      ),
    [joints],
  );
  const viewJoints: ViewJoint[] = useMemo(
    () =>
      readable.map((j) => {
        const label = sets.membership[j.id] || null;
        const feature = features.find((f) => f.jointId === j.id);
        return {
          id: j.id,
          kind: j.kind,
          plane: { dipDirection: j.dipDirection, dip: j.dip },
          set: label,
          details: [
            ...(j.seq !== undefined
              ? [{ label: 'Joint', value: `${jointKindLabels[j.kind]} ${j.seq}` }]
              : []),
            ...(j.orientationText ? [{ label: 'As typed', value: j.orientationText }] : []),
            { label: 'Set', value: label ?? 'random (in no set)' },
            ...(feature?.orientation
              ? [{ label: 'On its own vs drive (RMR89)', value: feature.orientation.assessment }]
              : []),
          ],
        };
      }),
    [readable, sets.membership, features],
  );
  const viewSets: ViewSet[] = useMemo(
    () =>
      sets.sets.map((s) => ({
        label: s.label,
        mean: s.mean,
        count: s.countHere,
        k: s.k,
        alpha95: s.alpha95,
        assessment: s.orientation?.assessment ?? null,
      })),
    [sets.sets],
  );
  const unreadable = joints.length - readable.length;
  const earlier = sets.sets.reduce((n, s) => n + s.count - s.countHere, 0);
  return (
    <section className={styles.root} aria-label="Orientation of this round">
      <Subtitle1 as="h2">Orientation</Subtitle1>
      {unreadable > 0 && (
        <Caption1 className={styles.note}>
          {`${unreadable} joint${unreadable === 1 ? '' : 's'} not plotted: the orientation as typed cannot be read yet.`}
        </Caption1>
      )}
      <OrientationView
        joints={viewJoints}
        sets={viewSets}
        drive={drive}
        highContrast={highContrast}
        fileName={fileName}
        onAssign={onAssign}
        frictionAngle={frictionAngle}
        caption={
          `${readable.length} pole${readable.length === 1 ? '' : 's'} of this round.` +
          (earlier > 0
            ? ` The sets' means, k and α95 also count ${earlier} joint${earlier === 1 ? '' : 's'} of earlier rounds near the face (poles column: this round only).`
            : '')
        }
      />
      <RoofWedgeList sets={sets.sets} frictionAngle={frictionAngle} scope="this round" />
    </section>
  );
}
