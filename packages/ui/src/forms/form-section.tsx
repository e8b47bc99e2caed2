import { makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import type { ReactNode } from 'react';

const useStyles = makeStyles({
  group: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(12rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    margin: 0,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  legend: { paddingInline: tokens.spacingHorizontalS },
});

export interface FormSectionProps {
  /** The section's title, read out as the group's name */
  title: string;
  children: ReactNode;
}

/** A titled group of fields laid out in a grid that folds to one column on a narrow tablet. */
export function FormSection({ title, children }: FormSectionProps) {
  const styles = useStyles();
  return (
    <fieldset className={styles.group}>
      <legend className={styles.legend}>
        <Subtitle2>{title}</Subtitle2>
      </legend>
      {children}
    </fieldset>
  );
}
