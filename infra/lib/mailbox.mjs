// What the SMTP fake received (infra/fakes/smtp-fake.mjs keeps one <id>.json summary per message), and
// whether a set of notices arrived exactly once each, matched by Message-ID.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

/** The summaries of the messages in `dir` that `keep` accepts. */
export function receivedMail(dir, keep = () => true) {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .map((f) => JSON.parse(readFileSync(path.join(dir, f), 'utf8')))
    .filter(keep);
}

const bare = (id) => String(id ?? '').replace(/^<|>$/g, '');

/**
 * Matches the Message-IDs of the notices (as the database keeps them) with the messages received:
 * `missing` notices never received, `duplicated` Message-IDs received more than once, `strangers`
 * messages that match no notice.
 */
export function deliveryReport(messageIds, received) {
  const perId = new Map();
  for (const m of received) perId.set(bare(m.messageId), (perId.get(bare(m.messageId)) ?? 0) + 1);
  const wanted = new Set(messageIds.map(bare));
  return {
    missing: [...wanted].filter((id) => !perId.has(id)),
    duplicated: [...perId].filter(([, n]) => n > 1).map(([id]) => id),
    strangers: [...perId.keys()].filter((id) => !wanted.has(id)),
  };
}
