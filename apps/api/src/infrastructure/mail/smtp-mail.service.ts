import { Inject, Injectable, type OnApplicationShutdown } from '@nestjs/common';
import nodemailer, { type Transporter } from 'nodemailer';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { MailService, type MailMessage } from './mail.service.js';

@Injectable()
export class SmtpMailService extends MailService implements OnApplicationShutdown {
  private readonly transporter: Transporter;
  private readonly from: string;
  private readonly target: string;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    super();
    const m = config.mail;
    this.from = m.from;
    this.target = `${m.host}:${m.port}`;
    this.transporter = nodemailer.createTransport({
      host: m.host,
      port: m.port,
      secure: m.secure,
      ignoreTLS: m.ignoreTls, // local SMTP fake only: its bundled certificate has expired
      auth: m.user ? { user: m.user, pass: m.password ?? '' } : undefined,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 15000,
      // Keep a few connections open for the jobs worker's parallel sends (one per worker slot).
      pool: true,
      maxConnections: config.jobs.concurrency,
    });
  }

  async send(message: MailMessage): Promise<{ messageId: string }> {
    const info = (await this.transporter.sendMail({
      from: this.from,
      to: message.to,
      cc: message.cc,
      subject: message.subject,
      text: message.text,
      html: message.html,
      attachments: message.attachments,
      messageId: message.messageId,
    })) as { messageId: string };
    return { messageId: info.messageId };
  }

  async check(): Promise<string> {
    await this.transporter.verify();
    return `SMTP ${this.target} answering`;
  }

  /** After the jobs worker has stopped (it stops in beforeApplicationShutdown). */
  onApplicationShutdown(): void {
    this.transporter.close();
  }
}
