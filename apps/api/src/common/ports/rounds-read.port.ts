// Ports through which setup modules ask about rounds without importing the rounds module (setup never
// depends on rounds; rounds implements these and provides them globally).
import type { RoundFacts, Stage } from '@roundbook/domain';

export const ROUNDS_READ = Symbol('ROUNDS_READ');

/** A round's stored facts for the trigger try-out, with what identifies it on screen. */
export interface RoundFactsRow {
  roundId: string;
  headingId: string;
  roundNumber: number;
  stage: Stage;
  faceChainage: number;
  shiftDate: string;
  facts: RoundFacts;
}

export interface RoundsReadPort {
  /** How many rounds a heading has (a drive or profile change then needs a confirmation). */
  countForHeading(headingId: string): Promise<number>;
  /** The latest rounds of each of the given headings (newest first, at most perHeading each) with their facts. */
  latestFacts(headingIds: string[], perHeading: number): Promise<RoundFactsRow[]>;
}
