import { NOTICE_SETTINGS, noticeSettingOf, noticeSettingWords, redNoticeWords } from '../src/notices.js';

describe('review notice settings (issue 11 item 4)', () => {
  it('maps each review e-mail kind to its own setting, one for one', () => {
    const kinds = ['submitted', 'rule-overdue', 'returned', 'confirmed-other-class'] as const;
    const settings = kinds.map(noticeSettingOf);
    expect(settings).toEqual(['submitted', 'ruleOverdue', 'returned', 'confirmedOtherClass']);
    expect([...settings].sort()).toEqual([...NOTICE_SETTINGS].sort());
  });

  it('has words for every setting and a reason for the locked red notices', () => {
    for (const s of NOTICE_SETTINGS) {
      expect(noticeSettingWords[s].label.length).toBeGreaterThan(5);
      expect(noticeSettingWords[s].description).toMatch(/^Sent to /);
    }
    expect(redNoticeWords.lockedReason).toMatch(/cannot be switched off/);
  });
});
