import { escapeHtml } from './escape.js';

/** The caution every review e-mail carries (product.md "Cautions"). */
export const REVIEW_EMAIL_CAUTION =
  'Roundbook computes and records; the responsible engineer decides under the project’s design and local regulations.';

export interface ReviewEmail {
  kind: 'submitted' | 'returned' | 'confirmed-other-class' | 'rule-overdue';
  /** The round is at the red trigger level: said first in the subject and the headline. */
  red?: boolean;
  projectName: string;
  /** e.g. "TH round 12 (full-face) at 1+015.0" */
  roundTitle: string;
  actorName: string;
  link: string;
  /** Lines of detail (class, trigger level, comments), each shown as its own line or paragraph. */
  lines: string[];
}

const HEADLINE: Record<ReviewEmail['kind'], (e: ReviewEmail) => string> = {
  submitted: (e) => `${e.actorName} submitted ${e.roundTitle} for review.`,
  returned: (e) => `${e.actorName} returned ${e.roundTitle} to you with comments.`,
  'confirmed-other-class': (e) =>
    `${e.actorName} confirmed ${e.roundTitle} with a support class other than the one recommended.`,
  'rule-overdue': (e) => `A fired rule on ${e.roundTitle} ran past its time without being acknowledged.`,
};
const SUBJECT: Record<ReviewEmail['kind'], (e: ReviewEmail) => string> = {
  submitted: (e) => `To confirm: ${e.roundTitle} — ${e.projectName}`,
  returned: (e) => `Returned: ${e.roundTitle} — ${e.projectName}`,
  'confirmed-other-class': (e) => `Confirmed with another class: ${e.roundTitle} — ${e.projectName}`,
  'rule-overdue': (e) => `Overdue: ${e.roundTitle} — ${e.projectName}`,
};
const BUTTON: Record<ReviewEmail['kind'], string> = {
  submitted: 'Review the round',
  returned: 'Open the round',
  'confirmed-other-class': 'Open the round',
  'rule-overdue': 'Open the round',
};

/** A review notice: plain text and a narrow HTML part (reads on a phone) with the same words. */
export function reviewEmail(e: ReviewEmail): { subject: string; text: string; html: string } {
  const headline = (e.red ? 'Red trigger level. ' : '') + HEADLINE[e.kind](e);
  const text = [
    headline,
    '',
    ...e.lines,
    ...(e.lines.length ? [''] : []),
    `Open the round (sign in if asked): ${e.link}`,
    '',
    REVIEW_EMAIL_CAUTION,
    '',
    `Roundbook — ${e.projectName}`,
  ].join('\n');
  const html = `<div style="font-family:'Open Sans',Arial,sans-serif;font-size:16px;line-height:1.5;color:#1d2327;max-width:560px">
<p style="font-size:18px"><strong>${escapeHtml(headline)}</strong></p>
${e.lines.map((l) => `<p style="margin:4px 0">${escapeHtml(l)}</p>`).join('\n')}
<p><a href="${escapeHtml(e.link)}" style="display:inline-block;padding:14px 22px;background:#1f5f7a;color:#ffffff;text-decoration:none;border-radius:6px">${BUTTON[e.kind]}</a></p>
<p style="font-size:13px;color:#4a555c">If the button does not work, copy this address into your browser:<br>${escapeHtml(e.link)}</p>
<p style="font-size:14px;padding:10px;border-left:4px solid #b26a00;background:#fff6e5">${escapeHtml(REVIEW_EMAIL_CAUTION)}</p>
<p style="font-size:13px;color:#4a555c">Roundbook — ${escapeHtml(e.projectName)}</p>
</div>`;
  return { subject: (e.red ? 'Red — ' : '') + SUBJECT[e.kind](e), text, html };
}
