import { makeStyles, tokens } from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';

/** The layout the handover screens share (Received, a heading's Handovers tab and its composer). */
export const useHandoverStyles = makeStyles({
  list: {
    listStyle: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    rowGap: '12px',
  },
  card: { padding: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS },
  /** An overdue handover: a thick edge in the danger colour, beside its badge's mark and words. */
  overdue: { borderLeft: `8px solid ${tokens.colorPaletteRedBorderActive}` },
  top: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  title: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  muted: { color: tokens.colorNeutralForeground2 },
  bar: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'flex-end' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
  control: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '180px' },
  section: { borderTop: `1px solid ${tokens.colorNeutralStroke2}`, paddingTop: tokens.spacingVerticalS },
});
