import type { RoundAssessment } from '@roundbook/domain';
import { In, type EntityManager } from 'typeorm';
import { Photo } from '../photos/photo.entity.js';
import { RoundRevision } from '../rounds/round-revision.entity.js';
import type { Round } from '../rounds/round.entity.js';
import { sketchRenderKey } from '../rounds/sketch-render.service.js';
import type { HandoverPictures } from './handover.entity.js';

/** Up to this many photos' thumbnails go into a heading's part of the PDF. */
export const HANDOVER_PHOTOS = 6;

const sketchElements = (record: Record<string, unknown>): number => {
  const sketch = record.sketch as { elements?: unknown[] } | null | undefined;
  return Array.isArray(sketch?.elements) ? sketch.elements.length : 0;
};

/**
 * What the PDF draws for a heading, frozen with the handover (the bytes are fetched by the PDF job): the
 * latest handed-in round's sketch render, the poles of the recent rounds' joints by set with the latest
 * round's set means and the drive, and the recent rounds' photos (newest round first), up to six.
 */
export async function handoverPictures(
  manager: EntityManager,
  projectId: string,
  driveTrend: number,
  recent: Round[],
): Promise<HandoverPictures> {
  if (recent.length === 0) return { sketch: null, sketchRound: null, photos: [], stereonet: null };
  const ids = recent.map((r) => r.id);
  const revisions = await manager.getRepository(RoundRevision).find({
    where: { roundId: In(ids) },
    order: { revision: 'DESC' },
  });
  const newest = new Map<string, RoundRevision>();
  for (const r of revisions) if (!newest.has(r.roundId)) newest.set(r.roundId, r);

  const latest = recent[0];
  const submitted = revisions.find(
    (r) => r.roundId === latest.id && r.event === 'submit' && sketchElements(r.record) > 0,
  );
  const sketch = submitted
    ? {
        roundNumber: latest.roundNumber,
        key: sketchRenderKey(projectId, latest.id, submitted.revision, 'png'),
      }
    : null;

  const poles: NonNullable<HandoverPictures['stereonet']>['poles'] = [];
  const rounds: number[] = [];
  for (const r of recent) {
    const rev = newest.get(r.id);
    if (!rev) continue;
    const membership = (rev.assessment as RoundAssessment | null)?.sets?.membership ?? {};
    const joints = Array.isArray(rev.record.joints)
      ? (rev.record.joints as Array<{ id: string; dipDirection?: number | null; dip?: number | null }>)
      : [];
    let any = false;
    for (const j of joints) {
      if (typeof j.dipDirection !== 'number' || typeof j.dip !== 'number') continue;
      poles.push({ dipDirection: j.dipDirection, dip: j.dip, set: membership[j.id] || null });
      any = true;
    }
    if (any) rounds.push(r.roundNumber);
  }
  const latestSets = (newest.get(latest.id)?.assessment as RoundAssessment | null)?.sets?.sets ?? [];
  const stereonet =
    poles.length > 0
      ? {
          rounds: rounds.sort((a, b) => a - b),
          driveTrend,
          poles,
          sets: latestSets.map((s) => ({
            label: s.label,
            dipDirection: s.mean.dipDirection,
            dip: s.mean.dip,
            count: s.count,
          })),
        }
      : null;

  const order = new Map(recent.map((r, i) => [r.id, i]));
  const number = new Map(recent.map((r) => [r.id, r.roundNumber]));
  const photos = (
    await manager.getRepository(Photo).find({
      where: { roundId: In(ids), uploadState: 'stored' },
      order: { createdAt: 'ASC' },
    })
  )
    .sort((a, b) => order.get(a.roundId)! - order.get(b.roundId)!)
    .slice(0, HANDOVER_PHOTOS)
    .map((p) => ({ roundNumber: number.get(p.roundId)!, caption: p.caption, key: p.thumbnailKey }));

  return { sketch, sketchRound: latest.roundNumber, photos, stereonet };
}
