import {
  Button,
  Caption1,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  Subtitle1,
  Text,
  tokens,
} from '@fluentui/react-components';
import { ArrowDownloadRegular, AttachRegular } from '@fluentui/react-icons';
import { formatProjectTime } from '@roundbook/domain';
import { EmptyState, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useState } from 'react';
import type { MailMessage } from '@/api/contract';
import { useDownloadAttachment } from '@/features/mail/api/download-attachment';
import { formatSize } from '@/features/mail/utils/format-size';

export interface MailInboxProps {
  /** Newest first. */
  messages: MailMessage[];
}

const useStyles = makeStyles({
  layout: {
    display: 'grid',
    gridTemplateColumns: 'minmax(16rem, 22rem) minmax(0, 1fr)',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
    '@media (max-width: 900px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  list: {
    listStyleType: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '4px',
  },
  item: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'flex-start',
    width: '100%',
    minHeight: `${TOUCH_TARGET_PX + 16}px`,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    textAlign: 'start',
    rowGap: '2px',
  },
  itemSelected: {
    backgroundColor: tokens.colorBrandBackground2,
    outline: `${tokens.strokeWidthThick} solid ${tokens.colorBrandStroke1}`,
  },
  itemSubject: { fontWeight: tokens.fontWeightSemibold },
  detail: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    minWidth: 0,
  },
  meta: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalXS,
    margin: 0,
  },
  subject: { margin: 0 },
  metaTerm: { color: tokens.colorNeutralForeground2 },
  metaValue: { margin: 0, overflowWrap: 'anywhere' },
  body: {
    margin: 0,
    padding: tokens.spacingHorizontalM,
    whiteSpace: 'pre-wrap',
    overflowWrap: 'anywhere',
    fontFamily: tokens.fontFamilyBase,
    fontSize: tokens.fontSizeBase300,
    lineHeight: tokens.lineHeightBase300,
    backgroundColor: tokens.colorNeutralBackground2,
    borderRadius: tokens.borderRadiusMedium,
  },
  frame: {
    width: '100%',
    minHeight: '24rem',
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusMedium,
    // The e-mail's HTML is drawn on white whatever the app theme, as a mail program would
    // (the static inverted foreground is the one token that is white in every theme).
    backgroundColor: tokens.colorNeutralForegroundStaticInverted,
  },
  attachments: {
    listStyleType: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexWrap: 'wrap',
    gap: '8px',
  },
  touch: { minHeight: `${TOUCH_TARGET_PX}px` },
});

function formatMailDate(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return formatProjectTime(date, Intl.DateTimeFormat().resolvedOptions().timeZone);
}

function MessageDetail({ message }: { message: MailMessage }) {
  const styles = useStyles();
  const download = useDownloadAttachment();
  return (
    <article className={styles.detail} aria-label={`E-mail: ${message.subject}`} data-testid="mail-detail">
      <Subtitle1 as="h2" className={styles.subject}>
        {message.subject === '' ? '(no subject)' : message.subject}
      </Subtitle1>
      <dl className={styles.meta}>
        <dt className={styles.metaTerm}>From</dt>
        <dd className={styles.metaValue}>{message.from}</dd>
        <dt className={styles.metaTerm}>To</dt>
        <dd className={styles.metaValue}>{message.to.join(', ')}</dd>
        <dt className={styles.metaTerm}>Received</dt>
        <dd className={styles.metaValue}>{formatMailDate(message.date)}</dd>
      </dl>

      {message.attachments.length > 0 && (
        <section aria-label="Attachments">
          <Text weight="semibold" as="h3" block>
            Attachments
          </Text>
          <ul className={styles.attachments}>
            {message.attachments.map((attachment) => (
              <li key={attachment.index}>
                <Button
                  className={styles.touch}
                  icon={<ArrowDownloadRegular />}
                  onClick={() =>
                    download.mutate({
                      messageId: message.id,
                      index: attachment.index,
                      filename: attachment.filename,
                    })
                  }
                >
                  {`${attachment.filename} (${formatSize(attachment.size)})`}
                </Button>
              </li>
            ))}
          </ul>
          {download.isError && (
            <MessageBar intent="error">
              <MessageBarBody>{`The attachment could not be fetched: ${download.error.message}`}</MessageBarBody>
            </MessageBar>
          )}
        </section>
      )}

      <section aria-label="Plain text">
        <Text weight="semibold" as="h3" block>
          Plain text
        </Text>
        <pre className={styles.body}>
          {message.text === '' ? '(this e-mail has no plain-text part)' : message.text}
        </pre>
      </section>

      {message.html !== null && (
        <section aria-label="Formatted version">
          <Text weight="semibold" as="h3" block>
            Formatted version
          </Text>
          {/* An empty sandbox: no scripts, no forms, no navigation, no same-origin access. */}
          <iframe
            className={styles.frame}
            title={`Formatted version of “${message.subject}”`}
            sandbox=""
            srcDoc={message.html}
          />
        </section>
      )}
    </article>
  );
}

/** Everything the local SMTP fake has received: a list on the left, the chosen e-mail on the right. */
export function MailInbox({ messages }: MailInboxProps) {
  const styles = useStyles();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const selected = messages.find((m) => m.id === selectedId) ?? messages[0];

  if (selected === undefined) {
    return (
      <EmptyState
        title="No e-mails received yet"
        message="Anything Roundbook sends while it runs locally (handovers, notices) lands here instead of in a real mailbox."
      />
    );
  }

  return (
    <div className={styles.layout}>
      <nav aria-label="Received e-mails">
        <ul className={styles.list}>
          {messages.map((message) => {
            const isSelected = message.id === selected.id;
            return (
              <li key={message.id}>
                <Button
                  appearance="subtle"
                  className={mergeClasses(styles.item, isSelected && styles.itemSelected)}
                  aria-current={isSelected ? 'true' : undefined}
                  onClick={() => setSelectedId(message.id)}
                >
                  <span className={styles.itemSubject}>
                    {message.subject === '' ? '(no subject)' : message.subject}
                    {message.attachments.length > 0 && <AttachRegular aria-label="has attachments" />}
                  </span>
                  <Caption1>{message.to.join(', ')}</Caption1>
                  <Caption1>{formatMailDate(message.date)}</Caption1>
                </Button>
              </li>
            );
          })}
        </ul>
      </nav>
      <MessageDetail message={selected} />
    </div>
  );
}
