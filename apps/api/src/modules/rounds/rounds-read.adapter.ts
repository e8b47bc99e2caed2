import { Inject, Injectable } from '@nestjs/common';
import { ModuleRef } from '@nestjs/core';
import { InjectDataSource } from '@nestjs/typeorm';
import { ASSESSMENT_VERSION } from '@roundbook/domain';
import { DataSource, In } from 'typeorm';
import type { RoundFactsRow, RoundsReadPort } from '../../common/ports/rounds-read.port.js';
import { Joint } from './joint.entity.js';
import { RoundAssessor } from './round-assessor.service.js';
import { Round } from './round.entity.js';

/**
 * What setup modules may ask about rounds (the port they declare). It depends on the database only; the
 * assessor (which itself reads setup) is looked up when a round without a current assessment needs one.
 */
@Injectable()
export class RoundsReadAdapter implements RoundsReadPort {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(ModuleRef) private readonly moduleRef: ModuleRef,
  ) {}

  countForHeading(headingId: string): Promise<number> {
    return this.dataSource.getRepository(Round).count({ where: { headingId } });
  }

  async latestFacts(headingIds: string[], perHeading: number): Promise<RoundFactsRow[]> {
    const out: RoundFactsRow[] = [];
    for (const headingId of headingIds) {
      const rounds = await this.dataSource
        .getRepository(Round)
        .find({ where: { headingId }, order: { roundNumber: 'DESC' }, take: perHeading });
      const current = (r: Round) => r.assessment !== null && r.assessmentVersion === ASSESSMENT_VERSION;
      const stale = rounds.filter((r) => !current(r));
      const joints = stale.length
        ? await this.dataSource.getRepository(Joint).find({ where: { roundId: In(stale.map((r) => r.id)) } })
        : [];
      for (const r of rounds) {
        // Rounds saved before assessments were stored (or under older rules) are assessed on the fly.
        const assessment = current(r)
          ? r.assessment!
          : await this.moduleRef.get(RoundAssessor, { strict: false }).assess(
              r,
              joints.filter((j) => j.roundId === r.id),
            );
        out.push({
          roundId: r.id,
          headingId: r.headingId,
          roundNumber: r.roundNumber,
          stage: r.stage,
          faceChainage: r.faceChainage,
          shiftDate: r.shiftDate,
          facts: assessment.facts,
        });
      }
    }
    return out;
  }
}
