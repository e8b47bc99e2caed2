import { makeStyles } from '@fluentui/react-components';

/** Minimum size of anything a gloved finger has to hit (WCAG 2.5.5 asks for 44 × 44 CSS px). */
export const TOUCH_TARGET_PX = 48;

export const useTouchTargetStyles = makeStyles({
  target: {
    minHeight: `${TOUCH_TARGET_PX}px`,
    minWidth: `${TOUCH_TARGET_PX}px`,
  },
});
