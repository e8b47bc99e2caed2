import { makeStyles, Switch } from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useThemePreference } from '@/app/theme-preference';

const useStyles = makeStyles({
  root: { minHeight: `${TOUCH_TARGET_PX}px`, alignItems: 'center' },
});

/** The poor-light switch: black background, strong outlines. Remembered on this device. */
export function HighContrastSwitch() {
  const styles = useStyles();
  const { mode, setMode } = useThemePreference();
  return (
    <Switch
      className={styles.root}
      label="High contrast"
      checked={mode === 'high-contrast'}
      onChange={(_event, data) => setMode(data.checked ? 'high-contrast' : 'light')}
    />
  );
}
