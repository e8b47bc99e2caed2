import { IsBoolean } from 'class-validator';

/** Which review notices the caller receives in this project. Red notices are always sent. */
export class NoticeSettingsDto {
  projectId: string;
  /** A round waits for review (sent to the project's engineers) */
  submitted: boolean;
  /** A fired rule ran past its time unacknowledged (engineers and the owning role) */
  ruleOverdue: boolean;
  /** The caller's round was returned with comments (the geologist who mapped it) */
  returned: boolean;
  /** The caller's round was confirmed with another class than recommended (the geologist who mapped it) */
  confirmedOtherClass: boolean;
  /** Notices about a red trigger level: always true, they cannot be switched off */
  red: boolean;
  /** Why red notices cannot be switched off */
  redLockedReason: string;
  /** When the caller last changed them; null while they are the defaults (all on) */
  updatedAt: string | null;
}

/** The whole choice, sent at once. `red` must be true: red notices cannot be switched off. */
export class UpdateNoticeSettingsDto {
  @IsBoolean()
  submitted: boolean;

  @IsBoolean()
  ruleOverdue: boolean;

  @IsBoolean()
  returned: boolean;

  @IsBoolean()
  confirmedOtherClass: boolean;

  /** Must be true; false is refused (400) with the reason */
  @IsBoolean()
  red: boolean;
}
