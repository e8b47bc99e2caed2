// Local SMTP fake: accepts every message on 127.0.0.1, parses it with mailparser and keeps it under the mail
// folder as <id>.eml (raw), <id>.json (summary) and <id>.att<n> (attachments) for the local mail view.
import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

const port = Number(process.env.SMTP_FAKE_PORT ?? 2525);
const dir = process.env.SMTP_FAKE_DIR ?? '.data/mail';
mkdirSync(dir, { recursive: true });

const addressList = (a) =>
  a ? (Array.isArray(a) ? a : [a]).flatMap((x) => x.value.map((v) => v.address)) : [];

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'], // smtp-server's bundled certificate has expired; local use only
  size: 30 * 1024 * 1024,
  logger: false,
  onData(stream, session, callback) {
    const chunks = [];
    stream.on('data', (c) => chunks.push(c));
    stream.on('end', () => {
      const raw = Buffer.concat(chunks);
      simpleParser(raw)
        .then((mail) => {
          const id = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}`;
          writeFileSync(path.join(dir, `${id}.eml`), raw);
          const attachments = (mail.attachments ?? []).map((a, index) => {
            writeFileSync(path.join(dir, `${id}.att${index}`), a.content);
            return {
              index,
              filename: a.filename ?? `attachment-${index}`,
              contentType: a.contentType,
              size: a.size,
            };
          });
          const summary = {
            id,
            from: mail.from?.text ?? '',
            to: addressList(mail.to),
            cc: addressList(mail.cc),
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            messageId: mail.messageId ?? null,
            date: (mail.date ?? new Date()).toISOString(),
            receivedAt: new Date().toISOString(),
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            attachments,
          };
          // Written aside, then renamed: a reader in another process never sees half a summary (a test read
          // one mid-write: "Unexpected end of JSON input"). The summary comes last, so the .eml is there too.
          writeFileSync(path.join(dir, `${id}.json.part`), JSON.stringify(summary, null, 2));
          renameSync(path.join(dir, `${id}.json.part`), path.join(dir, `${id}.json`));
          console.log(`received ${id}: ${summary.subject}`);
          callback();
        })
        .catch(callback);
    });
  },
});
server.on('error', (err) => console.error(`SMTP fake error: ${err.message}`));
server.listen(port, '127.0.0.1', () => console.log(`SMTP fake listening on 127.0.0.1:${port}`));

const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
