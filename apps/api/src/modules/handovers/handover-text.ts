import {
  cycleStageLabels,
  formatCalendarDate,
  formatChainageFor,
  formatHazardRange,
  formatProjectTime,
  hazardKindLabels,
  levelLabels,
  roleLabel,
  roundsAheadLabel,
  shiftLabels,
  stageLabels,
} from '@roundbook/domain';
import type { HandoverHeadingSnapshot, HandoverSnapshot } from './handover.entity.js';

/** The caution every handover carries, on screen, in the e-mail and in the PDF (product.md "Cautions"). */
export const HANDOVER_CAUTION =
  'This handover supports the face-to-face briefing at shift change and does not replace it. The competent person on site decides whether the ground is safe to enter; nobody enters unsupported ground.';

/** The words of one heading's handover, as label and value pairs (the e-mail and the PDF share them). */
export interface HeadingFacts {
  title: string;
  facts: Array<[string, string]>;
  alerts: string[];
  /** Open hazards, one line each: level as a word, kind, chainage range, description */
  hazards: string[];
  /** Support as built still outstanding, one line per item */
  supportOutstanding: string[];
  /** Features reaching the crown or invert ahead of the face, one line each (the e-mail) */
  lookAhead: string[];
  /** The same as table rows (the PDF): feature, crown, invert, ahead of the face, which round */
  lookAheadRows: LookAheadRow[];
  /** How the coming rounds were counted, e.g. "Rounds of 3 m (the next round length confirmed)." */
  lookAheadBasis: string;
  notes: string;
}

export interface LookAheadRow {
  feature: string;
  crown: string;
  invert: string;
  ahead: string;
  round: string;
}

/** The columns of the look-ahead table, in order. */
export const LOOK_AHEAD_COLUMNS: Array<[keyof LookAheadRow, string]> = [
  ['feature', 'Feature (mapped on)'],
  ['crown', 'Crown at'],
  ['invert', 'Invert at'],
  ['ahead', 'Ahead of the face'],
  ['round', 'Met'],
];

const metres = (m: number): string => `${Number(m.toFixed(2))} m`;

export function headingFacts(h: HandoverHeadingSnapshot): HeadingFacts {
  const chainage = (m: number) => formatChainageFor(m, h);
  const face =
    h.faceChainage === null
      ? 'No round handed in yet'
      : `${chainage(h.faceChainage)}${h.stage ? `, ${stageLabels[h.stage]}` : ''}${
          h.lastRoundNumber !== null ? ` (round ${h.lastRoundNumber})` : ''
        }`;
  const c = h.lastConfirmed;
  const confirmed = c
    ? `Round ${c.roundNumber} at ${chainage(c.faceChainage)}, ${stageLabels[c.stage]}`
    : 'No round confirmed yet';
  const supportClass = c?.classCode ? `${c.classCode} — ${c.className ?? ''}`.trim() : 'Not confirmed';
  const next = c?.nextRoundLength != null ? metres(c.nextRoundLength) : 'Not confirmed';
  const place = (ch: number | null, ahead: number | null): string =>
    ch === null ? 'runs along' : `${chainage(ch)}${ahead !== null && ahead <= 0 ? ' (passed)' : ''}`;
  const lookAheadRows: LookAheadRow[] = (h.lookAhead ?? []).map((f) => ({
    feature: `${f.label} (round ${f.roundNumber})${f.traceKnown ? '' : ', from the face centre'}`,
    crown: place(f.crownChainage, f.crownAhead),
    invert: place(f.invertChainage, f.invertAhead),
    ahead: `${f.nearestAhead.toFixed(1)} m (${f.firstAt})`,
    round: roundsAheadLabel(f.roundsAhead),
  }));
  const roundLength = h.lookAheadRoundLength ?? null;
  const lookAheadBasis =
    roundLength === null
      ? 'No round length is known, so the coming rounds are not counted.'
      : `Coming rounds counted at ${metres(roundLength)} each (${
          c?.nextRoundLength != null
            ? 'the next round length confirmed'
            : 'the heading’s planned round length'
        }). Worked out from the face maps of the latest rounds handed in.`;
  return {
    title: `${h.code} — ${h.name}`,
    facts: [
      ['Face', face],
      ['Cycle', h.cycleStage ? cycleStageLabels[h.cycleStage] : 'Not given'],
      ['Last confirmed round', confirmed],
      ['Support class (confirmed)', supportClass],
      ['Next round length (confirmed)', next],
      ['Trigger level', h.triggerLevel ? levelLabels[h.triggerLevel] : 'Not evaluated'],
    ],
    alerts: h.alerts.map(
      (a) => `${levelLabels[a.level]}: ${a.summary} — ${a.action} (owner: ${roleLabel(a.ownerRole)})`,
    ),
    hazards: (h.hazards ?? []).map(
      (z) =>
        `${levelLabels[z.level]} — ${hazardKindLabels[z.kind]}, ${formatHazardRange(z, h)}: ${z.description}`,
    ),
    supportOutstanding: h.supportOutstanding ?? [],
    lookAhead: (h.lookAhead ?? []).map(
      (f, i) =>
        `${lookAheadRows[i].feature}: reaches the ${f.firstAt} ${f.nearestAhead.toFixed(1)} m ahead of the face, ${lookAheadRows[i].round} — crown at ${lookAheadRows[i].crown}, invert at ${lookAheadRows[i].invert}`,
    ),
    lookAheadRows,
    lookAheadBasis,
    notes: h.notes,
  };
}

/** "Handover TH, HR, day shift 3 Dec 2026 — Project" */
export function handoverSubject(s: HandoverSnapshot, shiftDate: string, shift: 'day' | 'night'): string {
  return `Handover ${s.headings.map((h) => h.code).join(', ')}, ${shiftLabels[shift].toLowerCase()} ${formatCalendarDate(shiftDate)} — ${s.projectName}`;
}

/** Who handed over to whom and when, in the project's time zone. */
export function handoverHeader(
  s: HandoverSnapshot,
  shiftDate: string,
  shift: 'day' | 'night',
  sentAt: Date,
): Array<[string, string]> {
  return [
    ['Shift', `${shiftLabels[shift]}, ${formatCalendarDate(shiftDate)}`],
    ['From', s.outgoing.name],
    ['To', s.incoming.name],
    ['Sent', `${formatProjectTime(sentAt, s.timeZone)} (${s.timeZone} time)`],
  ];
}
