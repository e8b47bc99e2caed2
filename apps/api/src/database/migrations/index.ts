import { Init1764633600000 } from './1764633600000-Init.js';
import { SetupLibrary1764720000000 } from './1764720000000-SetupLibrary.js';
import { Rounds1764806400000 } from './1764806400000-Rounds.js';
import { RoundTriggers1764892800000 } from './1764892800000-RoundTriggers.js';
import { RoundAssessments1764979200000 } from './1764979200000-RoundAssessments.js';
import { JobsAndOperators1796193536073 } from './1796193536073-JobsAndOperators.js';
import { HeadingAlignment1796196409420 } from './1796196409420-HeadingAlignment.js';
import { Review1796200000000 } from './1796200000000-Review.js';
import { Photos1796270000000 } from './1796270000000-Photos.js';
import { AuditCoalesce1796280000000 } from './1796280000000-AuditCoalesce.js';
import { TokenVersion1796290000000 } from './1796290000000-TokenVersion.js';
import { Hazards1796300000000 } from './1796300000000-Hazards.js';
import { Handovers1796310000000 } from './1796310000000-Handovers.js';
import { RoundSketch1796320000000 } from './1796320000000-RoundSketch.js';
import { SupportRecords1796330000000 } from './1796330000000-SupportRecords.js';
import { HandoverOverdue1796340000000 } from './1796340000000-HandoverOverdue.js';
import { NoticePreferences1796350000000 } from './1796350000000-NoticePreferences.js';
import { TriggerAcceptances1796360000000 } from './1796360000000-TriggerAcceptances.js';
import { RoundReadIndexes1796390000000 } from './1796390000000-RoundReadIndexes.js';
import { RoundMappedIndex1796390000001 } from './1796390000001-RoundMappedIndex.js';
import { JointSameFeature1796400000000 } from './1796400000000-JointSameFeature.js';
import { RoundStatusIndexes1796420000000 } from './1796420000000-RoundStatusIndexes.js';
import { SignInTallies1796430000000 } from './1796430000000-SignInTallies.js';
import { OverLengthRule1796440000000 } from './1796440000000-OverLengthRule.js';
import { RuleFiresOnChange1796450000000 } from './1796450000000-RuleFiresOnChange.js';
import { PhotoScale1796460000000 } from './1796460000000-PhotoScale.js';

/** Every migration, in order. Imported explicitly so the app, the CLI and Jest share one list. */
export const migrations = [
  Init1764633600000,
  SetupLibrary1764720000000,
  Rounds1764806400000,
  RoundTriggers1764892800000,
  RoundAssessments1764979200000,
  JobsAndOperators1796193536073,
  HeadingAlignment1796196409420,
  Review1796200000000,
  Photos1796270000000,
  AuditCoalesce1796280000000,
  TokenVersion1796290000000,
  Hazards1796300000000,
  Handovers1796310000000,
  RoundSketch1796320000000,
  SupportRecords1796330000000,
  HandoverOverdue1796340000000,
  NoticePreferences1796350000000,
  TriggerAcceptances1796360000000,
  RoundReadIndexes1796390000000,
  RoundMappedIndex1796390000001,
  JointSameFeature1796400000000,
  RoundStatusIndexes1796420000000,
  SignInTallies1796430000000,
  OverLengthRule1796440000000,
  RuleFiresOnChange1796450000000,
  PhotoScale1796460000000,
];
