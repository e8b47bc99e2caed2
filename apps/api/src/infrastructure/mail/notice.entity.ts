import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt } from '../../common/dto/timestamps.js';

/** An attachment of a notice: read from object storage when the notice is sent. */
export interface NoticeAttachment {
  filename: string;
  contentType: string;
  storageKey: string;
}

/**
 * One outgoing e-mail (the outbox). Its Message-ID is fixed when it is queued and `sent_at` is set once the
 * mail server took it, so a retried job never sends it twice and a resend after a crash reuses the same
 * Message-ID (receivers can drop the duplicate).
 */
@Entity('notices')
@Index('UQ_notices_message_id', ['messageId'], { unique: true })
export class Notice {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** What it is, e.g. `invitation` */
  @Column({ type: 'varchar', length: 64 })
  kind: string;

  @Column({ name: 'project_id', type: 'uuid', nullable: true })
  projectId: string | null;

  @Column({ name: 'to_addresses', type: 'json' })
  to: string[];

  @Column({ name: 'cc_addresses', type: 'json' })
  cc: string[];

  @Column({ type: 'varchar', length: 998 })
  subject: string;

  @Column({ name: 'text_body', type: 'mediumtext' })
  text: string;

  @Column({ name: 'html_body', type: 'mediumtext', nullable: true })
  html: string | null;

  /** The body holds a secret (an invitation link): it is cleared once sent */
  @Column({ type: 'boolean', default: false })
  sensitive: boolean;

  /** Files sent with it, kept in object storage until it is sent (the handover's PDF) */
  @Column({ type: 'json', nullable: true })
  attachments: NoticeAttachment[] | null;

  @Column({ name: 'message_id', type: 'varchar', length: 255 })
  messageId: string;

  @Column({ name: 'sent_at', type: 'datetime', precision: 3, nullable: true })
  sentAt: Date | null;

  @CreatedAt()
  createdAt: Date;
}
