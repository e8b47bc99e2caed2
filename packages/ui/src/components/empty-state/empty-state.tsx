import { makeStyles, Subtitle1, Text, tokens } from '@fluentui/react-components';
import type { ReactNode } from 'react';

export interface EmptyStateProps {
  title: string;
  message?: ReactNode;
  /** A large icon shown above the title. */
  icon?: ReactNode;
  /** A button or link that gets the person out of the empty state. */
  action?: ReactNode;
}

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'center',
    textAlign: 'center',
    rowGap: tokens.spacingVerticalM,
    paddingBlock: tokens.spacingVerticalXXXL,
    paddingInline: tokens.spacingHorizontalXL,
    border: `${tokens.strokeWidthThin} dashed ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusXLarge,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  icon: { fontSize: '48px', lineHeight: 1, color: tokens.colorBrandForeground1 },
  title: { margin: 0 },
  message: { margin: 0, maxWidth: '52ch', color: tokens.colorNeutralForeground2 },
});

export function EmptyState({ title, message, icon, action }: EmptyStateProps) {
  const styles = useStyles();
  return (
    <section className={styles.root} aria-label={title}>
      {icon !== undefined && (
        <span className={styles.icon} aria-hidden="true">
          {icon}
        </span>
      )}
      <Subtitle1 as="h2" className={styles.title}>
        {title}
      </Subtitle1>
      {message !== undefined && (
        <Text as="p" size={400} className={styles.message}>
          {message}
        </Text>
      )}
      {action}
    </section>
  );
}
