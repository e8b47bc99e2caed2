import { faceFrameOf, restoreSketch, sketchToSvg } from '@roundbook/domain';
import sharp from 'sharp';
import type { LoadedPictures } from '../modules/handovers/handover-pdf-images.js';
import type { HandoverHeadingSnapshot, HandoverSnapshot } from '../modules/handovers/handover.entity.js';
import { SKETCH_RENDER_PX_PER_M } from '../modules/rounds/sketch-render.service.js';

/**
 * The benchmark's handover (invented): two headings, each with the PNG of a face sketch rendered as the
 * sketch job renders it (domain sketchToSvg + sharp), a stereonet of 30 poles in three sets, and six photo
 * thumbnails as the photo job makes them (JPEG, 320 px on the long side, from a noisy picture so they
 * compress like photographs), with hazards, alerts and a look-ahead to lay out.
 */
export interface BenchHandover {
  snapshot: HandoverSnapshot;
  /** Each heading's picture bytes, as the PDF job reads them from storage */
  pictures: LoadedPictures[];
  /** Object keys of those bytes, in the same order (for the send benchmark, which stores them) */
  keys: Array<{ sketch: string; photos: string[] }>;
}

const PROFILE = {
  profileShape: 'horseshoe' as const,
  profileWidth: 6,
  profileHeight: 6,
  axisHeight: 3,
  benchHeight: null,
};

/** A seeded pseudo-random sequence (the same pictures every run). */
function random(seed: number): () => number {
  let s = seed;
  return () => {
    s = (s * 1103515245 + 12345) & 0x7fffffff;
    return s / 0x7fffffff;
  };
}

async function sketchPng(seed: number): Promise<Buffer> {
  const r = random(seed);
  const traces = Array.from({ length: 8 }, (_, i) => ({
    id: `t${i}`,
    kind: 'trace',
    mode: 'polyline',
    points: Array.from({ length: 5 }, (_, k) => [-2.8 + k * 1.3 + r() * 0.3, 0.4 + r() * 4.8]),
    link: null,
  }));
  const doc = restoreSketch({
    schemaVersion: 2,
    frame: 'face-m',
    elements: [
      ...traces,
      { id: 'w1', kind: 'water', at: [1.2, 1.1], state: 'flowing', inflowLpm: 4 },
      { id: 'l1', kind: 'label', at: [-1.5, 4.2], text: 'Invented: blocky gneiss' },
    ],
  });
  const frame = faceFrameOf(PROFILE, 'full-face');
  if (!frame) throw new Error('The benchmark profile cannot be drawn');
  const svg = sketchToSvg(doc, frame, {
    pxPerMetre: SKETCH_RENDER_PX_PER_M,
    title: `Invented bench heading · round ${seed}`,
  });
  return sharp(Buffer.from(svg)).png().toBuffer();
}

async function photoThumbnail(seed: number): Promise<Buffer> {
  const width = 320;
  const height = 240;
  const r = random(seed);
  const raw = Buffer.alloc(width * height * 3);
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      const base = 90 + 60 * Math.sin((x + seed * 13) / 37) * Math.cos(y / 29);
      for (let c = 0; c < 3; c++) raw[(y * width + x) * 3 + c] = Math.max(0, Math.min(255, base + r() * 50));
    }
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 80 })
    .toBuffer();
}

function heading(n: number): HandoverHeadingSnapshot {
  const r = random(100 + n);
  const sets = [
    { label: 'S1', dipDirection: 120, dip: 65 },
    { label: 'S2', dipDirection: 230, dip: 40 },
    { label: 'S3', dipDirection: 10, dip: 80 },
  ];
  const poles = Array.from({ length: 30 }, (_, i) => {
    const s = sets[i % 3];
    return {
      dipDirection: (s.dipDirection + (r() - 0.5) * 24 + 360) % 360,
      dip: Math.min(89, Math.max(5, s.dip + (r() - 0.5) * 14)),
      set: i === 29 ? null : s.label,
    };
  });
  const face = 1000 + n * 100 + 36;
  return {
    headingId: `00000000-0000-4000-8000-00000000000${n}`,
    code: `B${n}`,
    name: `Invented bench heading ${n}`,
    chainageStyle: 'km+m',
    chainageDecimals: 1,
    faceChainage: face,
    stage: 'full-face',
    lastRoundNumber: 12,
    lastConfirmed: {
      roundId: `00000000-0000-4000-8000-00000000010${n}`,
      roundNumber: 11,
      stage: 'full-face',
      faceChainage: face - 3,
      classId: null,
      classCode: 'C2',
      className: 'Pattern bolts and mesh',
      nextRoundLength: 3,
      confirmedAt: '2026-12-03T05:10:00.000Z',
    },
    triggerLevel: 'amber',
    alerts: [
      { level: 'amber', summary: 'Q < 4 → amber', action: 'Tell the engineer.', ownerRole: 'engineer' },
    ],
    hazards: [
      {
        id: `00000000-0000-4000-8000-00000000020${n}`,
        kind: 'wedge',
        fromChainage: face - 4,
        toChainage: face - 1,
        level: 'red',
        description: 'Invented: wedge of S1 and S2 in the right shoulder; scaled, not yet bolted.',
      },
      {
        id: `00000000-0000-4000-8000-00000000030${n}`,
        kind: 'water',
        fromChainage: face - 9,
        toChainage: face - 6,
        level: 'amber',
        description: 'Invented: dripping from the crown after the last blast.',
      },
    ],
    supportOutstanding: [`Round 11 (full face), C2: 4 of 12 rock bolts 3 m not yet installed`],
    lookAhead: [
      {
        label: 'fault 1',
        roundNumber: 12,
        crownChainage: face + 2.1,
        invertChainage: face - 1.4,
        crownAhead: 2.1,
        invertAhead: -1.4,
        nearestAhead: 2.1,
        firstAt: 'crown',
        roundsAhead: 1,
        traceKnown: true,
      },
    ],
    lookAheadRoundLength: 3,
    pictures: {
      sketch: { roundNumber: 12, key: `bench/handover/heading-${n}/sketch.png` },
      sketchRound: 12,
      photos: Array.from({ length: 6 }, (_, i) => ({
        roundNumber: 12 - Math.floor(i / 3),
        caption: `Invented photo ${i + 1} of the face`,
        key: `bench/handover/heading-${n}/photo-${i + 1}.jpg`,
      })),
      stereonet: {
        rounds: [10, 11, 12],
        driveTrend: 60,
        poles,
        sets: sets.map((s) => ({ ...s, count: 10 })),
      },
    },
    cycleStage: 'support',
    notes: 'Invented: bolting rig on the right side; mesh for the crown is at the portal.',
  };
}

export async function benchHandover(): Promise<BenchHandover> {
  const headings = [heading(1), heading(2)];
  const pictures: LoadedPictures[] = [];
  const keys: BenchHandover['keys'] = [];
  for (const [i, h] of headings.entries()) {
    pictures.push({
      sketch: await sketchPng(i + 1),
      photos: await Promise.all(Array.from({ length: 6 }, (_, k) => photoThumbnail(10 * (i + 1) + k))),
    });
    keys.push({ sketch: h.pictures!.sketch!.key, photos: h.pictures!.photos.map((p) => p.key!) });
  }
  return {
    snapshot: {
      projectName: 'Invented benchmark project',
      timeZone: 'Europe/Zurich',
      outgoing: { userId: '', name: 'Invented outgoing supervisor', email: 'out@roundbook.test' },
      incoming: { userId: '', name: 'Invented incoming supervisor', email: 'in@roundbook.test' },
      headings,
      generalNotes: 'Invented: the loader is back from the workshop.',
      extraRecipients: [],
    },
    pictures,
    keys,
  };
}
