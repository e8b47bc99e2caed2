export interface MailAttachment {
  filename: string;
  content: Buffer;
  contentType: string;
}

export interface MailMessage {
  to: string[];
  cc?: string[];
  subject: string;
  text: string;
  html?: string;
  attachments?: MailAttachment[];
  /** A fixed Message-ID (`<id@domain>`), so a message sent again is recognisably the same one */
  messageId?: string;
}

/** Outgoing e-mail behind an interface; SMTP in production and locally (against the SMTP fake). */
export abstract class MailService {
  abstract send(message: MailMessage): Promise<{ messageId: string }>;
  /** Reachability for /api/health: resolves with a short description or throws. */
  abstract check(): Promise<string>;
}
