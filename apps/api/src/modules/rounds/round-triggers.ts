import type { EntityManager } from 'typeorm';
import { Heading } from '../headings/heading.entity.js';
import { assessTriggers, type TriggerFiring } from '../trigger-rules/trigger-evaluation.js';
import { TriggerRule } from '../trigger-rules/trigger-rule.entity.js';
import { triggerRuleSummary } from '../trigger-rules/trigger-rule.rules.js';
import type { Joint } from './joint.entity.js';
import { inflowPer10m } from './round-computations.js';
import { Round } from './round.entity.js';

/** Works out a round's trigger level from the project's rules, the round's record and its joints. */
export async function assessRoundTriggers(
  manager: EntityManager,
  round: Round,
  joints: Array<Pick<Joint, 'kind' | 'setLabel' | 'dipDirection' | 'dip'>>,
): Promise<{ level: 'green' | 'amber' | 'red' | null; firings: TriggerFiring[] }> {
  const [rules, heading, previous] = await Promise.all([
    manager.find(TriggerRule, { where: { projectId: round.projectId } }),
    manager.findOneByOrFail(Heading, { id: round.headingId }),
    round.roundNumber > 1
      ? manager.findOne(Round, {
          where: { headingId: round.headingId, stage: round.stage, roundNumber: round.roundNumber - 1 },
          select: { id: true, recommendedClassId: true },
        })
      : Promise.resolve(null),
  ]);
  return assessTriggers(
    rules,
    {
      q: round.q,
      rmr: round.rmr,
      inflowPer10m: inflowPer10m(round.ground.inflowLpm, round.ground.inflowLengthM ?? round.roundLength),
      overbreakM3: round.ground.overbreakM3,
      faceChainage: round.faceChainage,
      recommendedClassId: round.recommendedClassId,
      previousClassId: previous ? previous.recommendedClassId : undefined,
      joints,
    },
    heading,
    triggerRuleSummary,
  );
}
