import { makeStyles, Text, Title2, tokens } from '@fluentui/react-components';
import type { ReactNode } from 'react';

export interface PageHeaderProps {
  /** The page's name; rendered as the page's only level-1 heading. */
  title: string;
  /** One line under the title (project, client, context). */
  subtitle?: ReactNode;
  /** Badges or buttons shown at the right (below the title on narrow screens). */
  actions?: ReactNode;
}

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    justifyContent: 'space-between',
    columnGap: tokens.spacingHorizontalXL,
    rowGap: tokens.spacingVerticalS,
    paddingBottom: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalL,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  text: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalXXS, minWidth: 0 },
  title: { margin: 0 },
  subtitle: { margin: 0, color: tokens.colorNeutralForeground2 },
  actions: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
});

export function PageHeader({ title, subtitle, actions }: PageHeaderProps) {
  const styles = useStyles();
  return (
    <header className={styles.root}>
      <div className={styles.text}>
        <Title2 as="h1" className={styles.title}>
          {title}
        </Title2>
        {subtitle !== undefined && (
          <Text as="p" size={400} className={styles.subtitle}>
            {subtitle}
          </Text>
        )}
      </div>
      {actions !== undefined && <div className={styles.actions}>{actions}</div>}
    </header>
  );
}
