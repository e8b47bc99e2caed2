import { invitationEmail } from './invitation.email.js';

// Issue 19, item 15: the e-mail uses the screens' words for the role and the project's time zone.
describe('invitation e-mail', () => {
  const base = {
    inviteeName: 'Ada Quarrell',
    inviterName: 'Test admin',
    projectName: 'Invented <Headrace>',
    link: 'https://roundbook.example/invitations/abc',
    // 23:30 UTC on the 3rd is 00:30 on the 4th in Oslo (UTC+1 in December).
    expiresAt: new Date('2026-12-03T23:30:00Z'),
    timeZone: 'Europe/Oslo',
  };

  it('names the viewer role "Read only", as the screens do, in both parts', () => {
    const mail = invitationEmail({ ...base, role: 'viewer' });
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('“Read only” (reads the records)');
      expect(part).not.toMatch(/viewer/i);
    }
  });

  it("gives the expiry in the project's time zone, not UTC", () => {
    const mail = invitationEmail({ ...base, role: 'geologist' });
    expect(mail.text).toContain('valid until 4 Dec 2026, 00:30 (Europe/Oslo time)');
    expect(mail.html).toContain('until 4 Dec 2026, 00:30 (Europe/Oslo time)');
    expect(mail.text).not.toContain('UTC');
    expect(mail.text.startsWith('Hello Ada Quarrell,')).toBe(true);
    expect(mail.html).toContain('Invented &lt;Headrace&gt;');
  });
});
