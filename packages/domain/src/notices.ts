// The e-mail notices of the review (issue 11), and the words for a person's choice of which to receive.
// Codes are what the API stores; the words are what the settings panel and the API's refusals say.

/** The notices a person may switch on or off, per project. All are on until the person says otherwise. */
export const NOTICE_SETTINGS = ['submitted', 'ruleOverdue', 'returned', 'confirmedOtherClass'] as const;
export type NoticeSetting = (typeof NOTICE_SETTINGS)[number];

export interface NoticeWords {
  label: string;
  /** When it is sent and to whom */
  description: string;
}

export const noticeSettingWords: Record<NoticeSetting, NoticeWords> = {
  submitted: {
    label: 'A round waits for review',
    description: 'Sent to the project’s engineers when a geologist submits a round.',
  },
  ruleOverdue: {
    label: 'A fired rule ran past its time',
    description:
      'Sent to the engineers and to the role that owns the rule when its time runs out without an acknowledgement.',
  },
  returned: {
    label: 'My round was returned',
    description: 'Sent to the geologist who mapped the round when an engineer returns it with comments.',
  },
  confirmedOtherClass: {
    label: 'My round was confirmed with another class',
    description:
      'Sent to the geologist who mapped the round when the engineer confirms a class other than the one recommended.',
  },
};

/** Notices about a round at the red trigger level: always sent, whatever the settings say. */
export const redNoticeWords = {
  label: 'Red trigger level',
  description:
    'A round submitted at red, or a rule overdue on a red round, is always sent to the people it concerns.',
  lockedReason:
    'Red notices cannot be switched off: a red level asks for action within its timeframe, so everyone it concerns is told.',
} as const;

/** The setting that decides whether a review e-mail of this kind reaches a person. */
export function noticeSettingOf(
  kind: 'submitted' | 'rule-overdue' | 'returned' | 'confirmed-other-class',
): NoticeSetting {
  switch (kind) {
    case 'submitted':
      return 'submitted';
    case 'rule-overdue':
      return 'ruleOverdue';
    case 'returned':
      return 'returned';
    case 'confirmed-other-class':
      return 'confirmedOtherClass';
  }
}
