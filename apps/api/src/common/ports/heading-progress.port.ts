// The Board's per-heading progress, read from rounds by the board read module; projects ask through this
// port, so the projects module never reads round tables.
export const HEADING_PROGRESS = Symbol('HEADING_PROGRESS');

/** What the rounds of one heading say on the Board. */
export interface HeadingProgress {
  /** The face furthest along the drive among rounds handed in (submitted, confirmed or returned) */
  faceChainage: number | null;
  /** A draft's face beyond that one (not yet handed in, so a typo there does not move the face); else null */
  draftFaceChainage: number | null;
  lastRoundAt: string | null;
  roundsToConfirm: number;
  /** Worst trigger level among the latest evaluated round of each stage of the heading */
  triggerLevel: 'green' | 'amber' | 'red' | null;
  /** The heading's latest handover: when it was sent and whether (when) it was acknowledged */
  lastHandover?: {
    sentAt: string;
    acknowledgedAt: string | null;
    ackDueAt: string;
    overdue: boolean;
  } | null;
  /** The class the engineer confirmed on the heading's most recently confirmed round */
  confirmedClass?: { code: string; roundNumber: number; stage: string; confirmedAt: string } | null;
  /** The latest confirmed round of a stage has support outstanding (support-records) */
  supportOutstanding?: boolean;
}

export interface HeadingProgressPort {
  progress(headingIds: string[], now?: Date): Promise<Map<string, HeadingProgress>>;
}
