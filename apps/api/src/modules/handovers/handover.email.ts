import { formatProjectTime } from '@roundbook/domain';
import { escapeHtml } from '../../infrastructure/mail/templates/escape.js';
import { HANDOVER_CAUTION, handoverHeader, handoverSubject, headingFacts } from './handover-text.js';
import type { HandoverSnapshot } from './handover.entity.js';

export interface HandoverEmailInput {
  snapshot: HandoverSnapshot;
  shiftDate: string;
  shift: 'day' | 'night';
  sentAt: Date;
  /** Where the incoming supervisor acknowledges it (after signing in) */
  link: string;
}

export interface HandoverOverdueInput extends Omit<HandoverEmailInput, 'link'> {
  ackDueAt: Date;
  /** The heading's page, where the handover is listed */
  link: string;
}

/** Told to the outgoing supervisor and the engineers when the incoming supervisor has not acknowledged in time. */
export function handoverOverdueEmail(e: HandoverOverdueInput): {
  subject: string;
  text: string;
  html: string;
} {
  const s = e.snapshot;
  const due = `${formatProjectTime(e.ackDueAt, s.timeZone)} (${s.timeZone} time)`;
  const lead = `${s.incoming.name} has not acknowledged the handover from ${s.outgoing.name}; it was due by ${due}.`;
  const ask = 'Check with the incoming shift that the handover was received and briefed face to face.';
  const header = handoverHeader(s, e.shiftDate, e.shift, e.sentAt);
  const text = [
    lead,
    '',
    ...header.map(([k, v]) => `${k}: ${v}`),
    '',
    ask,
    `Open the heading in Roundbook: ${e.link}`,
    '',
    HANDOVER_CAUTION,
    '',
    `Roundbook — ${s.projectName}`,
  ].join('\n');
  const html = `<div style="font-family:'Open Sans',Arial,sans-serif;font-size:16px;line-height:1.5;color:#1d2327;max-width:560px">
<p style="font-size:18px"><strong>${escapeHtml(lead)}</strong></p>
<table role="presentation" style="border-collapse:collapse;font-size:15px">${header
    .map(
      ([k, v]) =>
        `<tr><td style="padding:2px 8px 2px 0;color:#4a555c">${escapeHtml(k)}</td><td><strong>${escapeHtml(v)}</strong></td></tr>`,
    )
    .join('')}</table>
<p>${escapeHtml(ask)}</p>
<p><a href="${escapeHtml(e.link)}" style="display:inline-block;padding:14px 22px;background:#1f5f7a;color:#ffffff;text-decoration:none;border-radius:6px">Open the heading</a></p>
<p style="font-size:14px;padding:10px;border-left:4px solid #b26a00;background:#fff6e5">${escapeHtml(HANDOVER_CAUTION)}</p>
</div>`;
  return { subject: `Not acknowledged: ${handoverSubject(s, e.shiftDate, e.shift)}`, text, html };
}

/** The handover e-mail: plain text and a one-column HTML part that reads on a phone, with the same words. */
export function handoverEmail(e: HandoverEmailInput): { subject: string; text: string; html: string } {
  const s = e.snapshot;
  const header = handoverHeader(s, e.shiftDate, e.shift, e.sentAt);
  const headings = s.headings.map(headingFacts);
  const text = [
    `${s.outgoing.name} handed over to ${s.incoming.name}.`,
    '',
    ...header.map(([k, v]) => `${k}: ${v}`),
    '',
    ...headings.flatMap((h) => [
      h.title,
      ...h.facts.map(([k, v]) => `  ${k}: ${v}`),
      ...(h.alerts.length ? ['  Alerts:', ...h.alerts.map((a) => `    - ${a}`)] : ['  Alerts: none']),
      ...(h.hazards.length
        ? ['  Open hazards:', ...h.hazards.map((z) => `    - ${z}`)]
        : ['  Open hazards: none']),
      ...(h.supportOutstanding.length
        ? ['  Support outstanding:', ...h.supportOutstanding.map((s) => `    - ${s}`)]
        : ['  Support outstanding: none recorded']),
      ...(h.lookAhead.length
        ? ['  Look-ahead:', ...h.lookAhead.map((l) => `    - ${l}`), `    ${h.lookAheadBasis}`]
        : ['  Look-ahead: no mapped fault or shear zone reaches the crown or invert ahead']),
      ...(h.notes ? [`  Notes: ${h.notes}`] : []),
      '',
    ]),
    ...(s.generalNotes ? ['General notes:', s.generalNotes, ''] : []),
    `Acknowledge it in Roundbook (sign in if asked): ${e.link}`,
    'The PDF of this handover is attached.',
    '',
    HANDOVER_CAUTION,
    '',
    `Roundbook — ${s.projectName}`,
  ].join('\n');
  const row = ([k, v]: [string, string]) =>
    `<tr><td style="padding:2px 8px 2px 0;color:#4a555c;vertical-align:top">${escapeHtml(k)}</td><td style="padding:2px 0;vertical-align:top"><strong>${escapeHtml(v)}</strong></td></tr>`;
  const para = (t: string) => escapeHtml(t).replace(/\n/g, '<br>');
  const html = `<div style="font-family:'Open Sans',Arial,sans-serif;font-size:16px;line-height:1.5;color:#1d2327;max-width:560px">
<p style="font-size:18px"><strong>${escapeHtml(`${s.outgoing.name} handed over to ${s.incoming.name}.`)}</strong></p>
<table role="presentation" style="border-collapse:collapse;font-size:15px">${header.map(row).join('')}</table>
${headings
  .map(
    (h) => `<div style="margin:16px 0;padding:10px 12px;border:1px solid #c9d1d6;border-radius:6px">
<p style="margin:0 0 6px;font-size:17px"><strong>${escapeHtml(h.title)}</strong></p>
<table role="presentation" style="border-collapse:collapse;font-size:15px">${h.facts.map(row).join('')}</table>
<p style="margin:6px 0 2px"><strong>Alerts</strong></p>
${h.alerts.length ? `<ul style="margin:0;padding-left:20px">${h.alerts.map((a) => `<li>${escapeHtml(a)}</li>`).join('')}</ul>` : '<p style="margin:0">None</p>'}
<p style="margin:6px 0 2px"><strong>Open hazards</strong></p>
${h.hazards.length ? `<ul style="margin:0;padding-left:20px">${h.hazards.map((z) => `<li>${escapeHtml(z)}</li>`).join('')}</ul>` : '<p style="margin:0">None</p>'}
<p style="margin:6px 0 2px"><strong>Support outstanding</strong></p>
${h.supportOutstanding.length ? `<ul style="margin:0;padding-left:20px">${h.supportOutstanding.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>` : '<p style="margin:0">None recorded</p>'}
<p style="margin:6px 0 2px"><strong>Look-ahead</strong></p>
${h.lookAhead.length ? `<ul style="margin:0;padding-left:20px">${h.lookAhead.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul><p style="margin:2px 0 0;font-size:13px;color:#4a555c">${escapeHtml(h.lookAheadBasis)}</p>` : '<p style="margin:0">No mapped fault or shear zone reaches the crown or invert ahead</p>'}
${h.notes ? `<p style="margin:6px 0 0"><strong>Notes</strong><br>${para(h.notes)}</p>` : ''}
</div>`,
  )
  .join('\n')}
${s.generalNotes ? `<p><strong>General notes</strong><br>${para(s.generalNotes)}</p>` : ''}
<p><a href="${escapeHtml(e.link)}" style="display:inline-block;padding:14px 22px;background:#1f5f7a;color:#ffffff;text-decoration:none;border-radius:6px">Open and acknowledge</a></p>
<p style="font-size:13px;color:#4a555c">If the button does not work, copy this address into your browser:<br>${escapeHtml(e.link)}<br>The PDF of this handover is attached.</p>
<p style="font-size:14px;padding:10px;border-left:4px solid #b26a00;background:#fff6e5">${escapeHtml(HANDOVER_CAUTION)}</p>
<p style="font-size:13px;color:#4a555c">Roundbook — ${escapeHtml(s.projectName)}</p>
</div>`;
  return { subject: handoverSubject(s, e.shiftDate, e.shift), text, html };
}
