// The governing discontinuity of a round: the weakest significant one, from which Jr and Ja are taken
// (Barton et al. 1974; NGI 2015 handbook: "Jr and Ja should be relevant to the weakest significant joint
// set or clay-filled discontinuity" — from memory), and whose aperture and infill the RMR89 condition
// must agree with (Bieniawski 1989, Table 4.1 A4/E).
import {
  jnSetCountWarning,
  rmr89ConditionWarnings,
  type Rmr89Condition,
  type Rmr89Infilling,
} from '@roundbook/geomath';
import type { JointKind } from './vocabulary.js';
import { SINGLE_FEATURE_KINDS } from './vocabulary.js';

/** What the governing rules read of a joint of the round. */
export interface GoverningCandidate {
  id: string;
  seq: number;
  kind: JointKind;
  jr: number | null;
  ja: number | null;
  apertureMm: number | null;
  infill: string | null;
  thicknessM: number | null;
  /** The set the assessment put it in ('' or null: random or a single feature). */
  setLabel: string | null;
}

export interface GoverningDiscontinuity {
  /** 'named': the record names it; 'suggested': the weakest significant one found here (none named). */
  source: 'named' | 'suggested';
  jointId: string | null;
  setLabel: string | null;
  /** Words for the warning and the screen, e.g. "fault (joint 7)" or "set S2". */
  label: string;
  jr: number | null;
  ja: number | null;
  apertureMm: number | null;
  infill: Rmr89Infilling | null;
}

const SOFT = /clay|gouge|soft|silt|sand|talc|chlorite|graphite|mylonite|crushed|mud/i;
const HARD = /calcite|quartz|hard|epidote|cemented|vein/i;
const NONE = /^(none|clean|no infill|nil|-)$/i;

/**
 * The infill text of a joint read as the RMR89 infilling (Table 4.1 E): soft words (clay, gouge, silt …) or
 * hard ones (calcite, quartz …), thickness from the zone thickness or the aperture; null when not recorded
 * or not readable (common practice: the logging words of BS 5930 / ISRM 1978, from memory).
 */
export function infillOf(
  j: Pick<GoverningCandidate, 'infill' | 'apertureMm' | 'thicknessM'>,
): Rmr89Infilling | null {
  const text = (j.infill ?? '').trim();
  if (text === '') return null;
  if (NONE.test(text)) return { kind: 'none' };
  const kind = SOFT.test(text) ? 'soft' : HARD.test(text) ? 'hard' : null;
  if (kind === null) return null;
  const thicknessMm = j.thicknessM !== null && j.thicknessM > 0 ? j.thicknessM * 1000 : j.apertureMm;
  if (thicknessMm === null || thicknessMm === undefined) return null;
  return { kind, thicknessMm };
}

const strength = (j: GoverningCandidate): number | null =>
  j.jr !== null && j.ja !== null && j.ja > 0 ? j.jr / j.ja : null;

const describe = (j: GoverningCandidate): string =>
  `${SINGLE_FEATURE_KINDS.includes(j.kind) ? j.kind.replace('-', ' ') : (j.setLabel ? `set ${j.setLabel}, ` : '') + j.kind} (joint ${j.seq})`;

function fromJoint(j: GoverningCandidate, source: GoverningDiscontinuity['source']): GoverningDiscontinuity {
  return {
    source,
    jointId: j.id,
    setLabel: j.setLabel || null,
    label: describe(j),
    jr: j.jr,
    ja: j.ja,
    apertureMm: j.apertureMm,
    infill: infillOf(j),
  };
}

/**
 * The governing discontinuity: the joint or set the record names, or else the weakest significant one of
 * the round (lowest Jr/Ja among the faults, shear zones and set members that have both recorded).
 */
export function governingDiscontinuity(
  named: { jointId?: string | null; setLabel?: string | null },
  joints: GoverningCandidate[],
): { governing: GoverningDiscontinuity | null; warnings: string[] } {
  const warnings: string[] = [];
  if (named.jointId) {
    const j = joints.find((x) => x.id === named.jointId);
    if (j) return { governing: fromJoint(j, 'named'), warnings };
    warnings.push(
      'The governing discontinuity named for Jr and Ja is not a joint of this round any more: name it again.',
    );
  } else if (named.setLabel) {
    const members = joints.filter((x) => x.setLabel === named.setLabel);
    if (members.length) {
      const weakest = [...members].sort((a, b) => (strength(a) ?? Infinity) - (strength(b) ?? Infinity))[0];
      const apertures = members.map((m) => m.apertureMm).filter((v): v is number => v !== null);
      return {
        governing: {
          ...fromJoint(weakest, 'named'),
          jointId: null,
          setLabel: named.setLabel,
          label: `set ${named.setLabel}`,
          apertureMm: apertures.length ? Math.max(...apertures) : null,
        },
        warnings,
      };
    }
    warnings.push(`The governing set ${named.setLabel} named for Jr and Ja has no joint on this round.`);
  }
  const significant = joints.filter(
    (j) => strength(j) !== null && (SINGLE_FEATURE_KINDS.includes(j.kind) || (j.setLabel ?? '') !== ''),
  );
  if (significant.length === 0) return { governing: null, warnings };
  const weakest = [...significant].sort((a, b) => strength(a)! - strength(b)! || a.seq - b.seq)[0];
  return { governing: fromJoint(weakest, 'suggested'), warnings };
}

/**
 * Warnings where the typed Jr and Ja disagree with the governing discontinuity: with the one named, when
 * either differs from its record; with the one suggested (none named), when it is weaker than the typed pair.
 */
export function jrJaWarnings(typed: { jr: number; ja: number }, g: GoverningDiscontinuity): string[] {
  const out: string[] = [];
  if (g.source === 'named') {
    if (g.jr !== null && g.jr !== typed.jr)
      out.push(`Jr ${typed.jr} typed, but the governing ${g.label} is recorded with Jr ${g.jr}.`);
    if (g.ja !== null && g.ja !== typed.ja)
      out.push(`Ja ${typed.ja} typed, but the governing ${g.label} is recorded with Ja ${g.ja}.`);
    return out;
  }
  if (g.jr !== null && g.ja !== null && g.jr / g.ja < typed.jr / typed.ja - 1e-9)
    out.push(
      `Jr ${typed.jr} / Ja ${typed.ja} are not from the weakest significant discontinuity: ${g.label} is recorded with Jr ${g.jr} / Ja ${g.ja}. Take Jr and Ja from it, and name it as the governing one.`,
    );
  return out;
}

/** The RMR89 condition against the governing discontinuity's aperture and infill (geomath rmr89ConditionWarnings). */
export function conditionWarnings(condition: Rmr89Condition, g: GoverningDiscontinuity): string[] {
  return rmr89ConditionWarnings(condition, { apertureMm: g.apertureMm, infill: g.infill }).map(
    (w) => `${w.message} (${g.label})`,
  );
}

/** Jn against the sets found on this round and whether random joints were seen (geomath jnSetCountWarning). */
export function jnWarning(jn: number, setCount: number, randomJoints: boolean): string | null {
  return jnSetCountWarning(jn, setCount, randomJoints)?.message ?? null;
}
