import { formatProjectTime, roleLabel } from '@roundbook/domain';
import { escapeHtml } from './escape.js';

export interface InvitationEmail {
  inviteeName: string;
  inviterName: string;
  projectName: string;
  role: string;
  link: string;
  expiresAt: Date;
  /** The project's time zone: the expiry is given in it, as on every screen. */
  timeZone: string;
}

/** What each role does, after the role's name as the screens show it (packages/domain roleLabels). */
const ROLE_DUTIES: Record<string, string> = {
  admin: 'sets up headings, support classes, triggers and the team',
  geologist: 'records the rounds',
  engineer: 'reviews rounds and confirms support',
  supervisor: 'sends and acknowledges handovers',
  viewer: 'reads the records',
};

/** The invitation e-mail: plain text and a simple HTML version with the same words. */
export function invitationEmail(e: InvitationEmail): { subject: string; text: string; html: string } {
  const duty = ROLE_DUTIES[e.role];
  const role = `the role “${roleLabel(e.role)}”${duty ? ` (${duty})` : ''}`;
  const until = `${formatProjectTime(e.expiresAt, e.timeZone)} (${e.timeZone} time)`;
  const greeting = e.inviteeName ? `Hello ${e.inviteeName},` : 'Hello,';
  const text = [
    greeting,
    '',
    `${e.inviterName} has added you to "${e.projectName}" in Roundbook as ${role}.`,
    '',
    `Open this link to join (valid until ${until}, once). New to Roundbook? You choose your password there.`,
    'Already have an account for this address? Sign in with it, then open the link.',
    e.link,
    '',
    'If you did not expect this, ignore this message; nothing happens unless the link is used.',
    '',
    'Roundbook — round-by-round face records and shift handovers',
  ].join('\n');
  const html = `<div style="font-family:'Open Sans',Arial,sans-serif;font-size:15px;line-height:1.5;color:#1d2327">
<p>${escapeHtml(greeting)}</p>
<p>${escapeHtml(e.inviterName)} has added you to <strong>${escapeHtml(e.projectName)}</strong> in Roundbook as ${escapeHtml(role)}.</p>
<p><a href="${escapeHtml(e.link)}" style="display:inline-block;padding:12px 20px;background:#1f5f7a;color:#ffffff;text-decoration:none;border-radius:6px">Join the project</a></p>
<p style="font-size:13px;color:#4a555c">New to Roundbook? You choose your password there. Already have an account for this address? Sign in with it, then open the link.</p>
<p style="font-size:13px;color:#4a555c">The link works once, until ${escapeHtml(until)}. If the button does not work, copy this address into your browser:<br>${escapeHtml(e.link)}</p>
<p style="font-size:13px;color:#4a555c">If you did not expect this, ignore this message; nothing happens unless the link is used.</p>
</div>`;
  return { subject: `You are invited to ${e.projectName} in Roundbook`, text, html };
}
