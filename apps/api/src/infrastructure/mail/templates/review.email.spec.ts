import { REVIEW_EMAIL_CAUTION, reviewEmail } from './review.email.js';

describe('review e-mails', () => {
  const base = {
    projectName: 'Invented <Headrace>',
    roundTitle: 'TH round 3 (full-face) at 1+009.0',
    actorName: 'Test engineer',
    link: 'https://roundbook.example/projects/p/rounds/r',
    lines: ['Position: check the chainage & the length'],
  };
  it('has a subject, the link and the caution in both parts', () => {
    const mail = reviewEmail({ ...base, kind: 'returned' });
    expect(mail.subject).toBe('Returned: TH round 3 (full-face) at 1+009.0 — Invented <Headrace>');
    for (const part of [mail.text, mail.html]) expect(part).toContain(base.link);
    expect(mail.text).toContain(REVIEW_EMAIL_CAUTION);
    expect(mail.html).toContain('the project’s design and local regulations');
  });
  it('escapes what people typed in the HTML part', () => {
    const mail = reviewEmail({ ...base, kind: 'submitted' });
    expect(mail.html).toContain('Invented &lt;Headrace&gt;');
    expect(mail.html).toContain('the chainage &amp; the length');
    expect(mail.html).not.toContain('<Headrace>');
    expect(mail.text).toContain('Test engineer submitted TH round 3');
  });
  it('puts a red level first, in the subject and the headline', () => {
    const mail = reviewEmail({ ...base, kind: 'submitted', red: true });
    expect(mail.subject).toMatch(/^Red — To confirm: TH round 3/);
    expect(mail.text.startsWith('Red trigger level. Test engineer submitted')).toBe(true);
  });
});
