import {
  driveOf,
  fisherStatistics,
  planeCrossings,
  planeOfPole,
  poleOf,
  rmrOrientationInTunnel,
  type Plane,
} from '@roundbook/geomath';
import type { Comparison, TriggerRule } from './trigger-rule.entity.js';

/**
 * Evaluates one trigger rule against one round. Every number comes from the record or from packages/geomath.
 * Returns null when the rule does not fire, otherwise the value and a sentence saying why.
 */
export interface RoundFacts {
  q: number | null;
  rmr: number | null;
  inflowPer10m: number | null;
  overbreakM3: number | null;
  faceChainage: number;
  recommendedClassId: string | null;
  previousClassId: string | null | undefined; // undefined: no previous round of this heading and stage
  joints: Array<{ kind: string; setLabel: string | null; dipDirection: number | null; dip: number | null }>;
}

export interface HeadingGeometry {
  driveTrend: number;
  gradientPercent: number;
  profileHeight: number;
  profileWidth: number;
  axisHeight: number;
}

export type Firing = { value: number | null; detail: string } | null;

const compare = (a: number, op: Comparison, b: number): boolean =>
  op === '<' ? a < b : op === '<=' ? a <= b : op === '>' ? a > b : op === '>=' ? a >= b : a === b;

/** Mean plane of each labelled set (Fisher mean of the poles, axial), from the round's readable joints. */
export function setMeans(
  joints: RoundFacts['joints'],
): Array<{ label: string; plane: Plane; count: number }> {
  const groups = new Map<string, Plane[]>();
  for (const j of joints) {
    if (!j.setLabel || j.dipDirection === null || j.dip === null) continue;
    groups.set(j.setLabel, [...(groups.get(j.setLabel) ?? []), { dipDirection: j.dipDirection, dip: j.dip }]);
  }
  return [...groups].map(([label, planes]) => ({
    label,
    count: planes.length,
    plane:
      planes.length === 1
        ? planes[0]
        : planeOfPole(fisherStatistics(planes.map(poleOf), { axial: true }).mean),
  }));
}

export function evaluateRule(
  rule: Pick<TriggerRule, 'watch' | 'comparison' | 'threshold'>,
  round: RoundFacts,
  heading: HeadingGeometry,
): Firing {
  const numeric = (value: number | null, what: string, unit = ''): Firing =>
    value !== null &&
    rule.comparison &&
    rule.threshold !== null &&
    compare(value, rule.comparison, rule.threshold)
      ? {
          value,
          detail: `${what} ${Number(value.toPrecision(3))}${unit} ${rule.comparison} ${rule.threshold}${unit}`,
        }
      : null;
  switch (rule.watch) {
    case 'q':
      return numeric(round.q, 'Q');
    case 'rmr89':
      return numeric(round.rmr, 'RMR89');
    case 'inflow-per-10m':
      return numeric(round.inflowPer10m, 'Inflow', ' l/min per 10 m');
    case 'overbreak':
      return numeric(round.overbreakM3, 'Overbreak', ' m³');
    case 'support-class-change':
      return round.previousClassId !== undefined &&
        round.recommendedClassId !== null &&
        round.recommendedClassId !== round.previousClassId
        ? { value: null, detail: 'The recommended class differs from the last round’s.' }
        : null;
    case 'adverse-orientation': {
      const drive = driveOf(heading);
      const adverse = setMeans(round.joints)
        .map((s) => ({ s, r: rmrOrientationInTunnel(s.plane, drive) }))
        .filter(({ r }) => r.assessment === 'unfavourable' || r.assessment === 'very unfavourable');
      return adverse.length
        ? {
            value: null,
            detail: adverse
              .map(
                ({ s, r }) =>
                  `${s.label} (${Math.round(s.plane.dipDirection)}/${Math.round(s.plane.dip)}) is ${r.assessment} for the drive`,
              )
              .join('; '),
          }
        : null;
    }
    case 'crown-crossing-within': {
      if (rule.threshold === null) return null;
      const drive = driveOf(heading);
      const hits = round.joints
        .filter(
          (j) => (j.kind === 'fault' || j.kind === 'shear-zone') && j.dipDirection !== null && j.dip !== null,
        )
        .map((j) => {
          const c = planeCrossings({
            plane: { dipDirection: j.dipDirection!, dip: j.dip! },
            chainage: round.faceChainage,
            offset: { right: 0, up: 0 }, // mapped at the face centre until sketches give the trace's position
            drive,
            crownHeight: heading.profileHeight - heading.axisHeight,
            invertDepth: heading.axisHeight,
            halfWidth: heading.profileWidth / 2,
          });
          return c.crown;
        })
        .filter(
          (crown): crown is number =>
            crown !== null && crown > round.faceChainage && crown - round.faceChainage <= rule.threshold!,
        );
      if (!hits.length) return null;
      const nearest = Math.min(...hits) - round.faceChainage;
      return {
        value: nearest,
        detail: `A mapped fault reaches the crown ${nearest.toFixed(1)} m ahead of the face`,
      };
    }
    case 'open-red-hazard':
      return null; // hazards are recorded by a later feature; until then this rule cannot fire
  }
}

export interface TriggerFiring {
  ruleId: string;
  level: 'green' | 'amber' | 'red';
  summary: string;
  detail: string;
  action: string;
  ownerRole: string;
  timeAllowedHours: number;
}

const RANK = { green: 0, amber: 1, red: 2 } as const;

/**
 * The trigger level of a round: the highest level among the enabled rules that fire; green when rules exist
 * and none fires; null when the project has no enabled rule. Firings are listed red first.
 */
export function assessTriggers(
  rules: Array<
    Pick<
      TriggerRule,
      | 'id'
      | 'watch'
      | 'comparison'
      | 'threshold'
      | 'level'
      | 'action'
      | 'ownerRole'
      | 'timeAllowedHours'
      | 'enabled'
    >
  >,
  round: RoundFacts,
  heading: HeadingGeometry,
  summaryOf: (rule: Pick<TriggerRule, 'watch' | 'comparison' | 'threshold' | 'level'>) => string,
): { level: 'green' | 'amber' | 'red' | null; firings: TriggerFiring[] } {
  const active = rules.filter((r) => r.enabled);
  if (active.length === 0) return { level: null, firings: [] };
  const firings: TriggerFiring[] = [];
  for (const rule of active) {
    const fired = evaluateRule(rule, round, heading);
    if (fired) {
      firings.push({
        ruleId: rule.id,
        level: rule.level,
        summary: summaryOf(rule),
        detail: fired.detail,
        action: rule.action,
        ownerRole: rule.ownerRole,
        timeAllowedHours: rule.timeAllowedHours,
      });
    }
  }
  firings.sort((a, b) => RANK[b.level] - RANK[a.level]);
  return { level: firings[0]?.level ?? 'green', firings };
}
