// The Board's per-heading progress, read from rounds by the board read module; projects ask through this
// port, so the projects module never reads round tables.
export const HEADING_PROGRESS = Symbol('HEADING_PROGRESS');

/** What the rounds of one heading say on the Board. */
export interface HeadingProgress {
  faceChainage: number | null;
  lastRoundAt: string | null;
  roundsToConfirm: number;
  /** Worst trigger level among the latest evaluated round of each stage of the heading */
  triggerLevel: 'green' | 'amber' | 'red' | null;
}

export interface HeadingProgressPort {
  progress(headingIds: string[]): Promise<Map<string, HeadingProgress>>;
}
