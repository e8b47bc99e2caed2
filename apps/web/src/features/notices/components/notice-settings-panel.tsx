import {
  makeStyles,
  MessageBar,
  MessageBarBody,
  Spinner,
  Switch,
  Text,
  tokens,
} from '@fluentui/react-components';
import { LockClosedRegular } from '@fluentui/react-icons';
import { NOTICE_SETTINGS, noticeSettingWords, redNoticeWords, type NoticeSetting } from '@roundbook/domain';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useId, useState } from 'react';
import {
  useNoticeSettings,
  useSaveNoticeSettings,
  type NoticeSettings,
} from '@/features/notices/api/notice-settings';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';

export interface NoticeSettingsPanelProps {
  projectId: string;
  projectName: string;
}

const useStyles = makeStyles({
  section: {
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
    paddingTop: tokens.spacingVerticalM,
    borderTop: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  heading: { fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold, margin: 0 },
  list: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalS, margin: 0, padding: 0 },
  row: {
    listStyleType: 'none',
    display: 'flex',
    flexDirection: 'column',
    minHeight: `${TOUCH_TARGET_PX}px`,
    justifyContent: 'center',
  },
  description: { color: tokens.colorNeutralForeground2, paddingInlineStart: '48px' },
  locked: {
    listStyleType: 'none',
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalXS,
    padding: tokens.spacingVerticalS,
    borderLeft: `${tokens.strokeWidthThickest} solid ${tokens.colorPaletteRedBorder2}`,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  lockedTitle: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
});

/** Words a person can act on when the settings could not be read or saved. */
function describeProblem(error: unknown, what: string): string {
  if (isApiError(error)) {
    if (error.code === NETWORK_ERROR_CODE)
      return `The Roundbook server could not be reached, so ${what} did not happen. Try again when the connection is back.`;
    return `${what[0]?.toUpperCase() ?? ''}${what.slice(1)} did not work: ${error.message}`;
  }
  return `${what[0]?.toUpperCase() ?? ''}${what.slice(1)} did not work. Try again.`;
}

/**
 * The signed-in person's choice of review e-mails in one project: one switch per notice, saved as it is
 * flipped. Red notices are shown switched on and locked, with the reason; the API refuses to turn them off.
 */
export function NoticeSettingsPanel({ projectId, projectName }: NoticeSettingsPanelProps) {
  const styles = useStyles();
  const headingId = useId();
  const settings = useNoticeSettings(projectId);
  const save = useSaveNoticeSettings(projectId);
  const [saved, setSaved] = useState(false);

  const flip = (current: NoticeSettings, key: NoticeSetting, on: boolean) => {
    setSaved(false);
    save.mutate(
      {
        submitted: current.submitted,
        ruleOverdue: current.ruleOverdue,
        returned: current.returned,
        confirmedOtherClass: current.confirmedOtherClass,
        [key]: on,
        red: true,
      },
      { onSuccess: () => setSaved(true) },
    );
  };

  return (
    <section className={styles.section} aria-labelledby={headingId}>
      <h3 id={headingId} className={styles.heading}>
        {`E-mail notices in ${projectName}`}
      </h3>
      <Text>
        Choose which review e-mails reach you in this project. Your choice is yours alone: nobody else’s
        notices change.
      </Text>
      {settings.isPending && <Spinner size="small" label="Reading your notice settings…" />}
      {settings.isError && (
        <div role="alert">
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>{describeProblem(settings.error, 'reading your notice settings')}</MessageBarBody>
          </MessageBar>
        </div>
      )}
      {settings.data !== undefined && (
        <ul className={styles.list}>
          {NOTICE_SETTINGS.map((key) => {
            const words = noticeSettingWords[key];
            const current = settings.data;
            return (
              <li key={key} className={styles.row}>
                <Switch
                  label={words.label}
                  checked={current[key]}
                  disabled={save.isPending}
                  aria-describedby={`${headingId}-${key}`}
                  onChange={(_e, d) => flip(current, key, d.checked)}
                />
                <Text id={`${headingId}-${key}`} size={200} className={styles.description}>
                  {words.description}
                </Text>
              </li>
            );
          })}
          <li className={styles.locked}>
            <div className={styles.lockedTitle}>
              <Switch
                label={`${redNoticeWords.label} (always on)`}
                checked
                disabled
                aria-describedby={`${headingId}-red`}
              />
              <LockClosedRegular aria-hidden fontSize={20} />
            </div>
            <Text id={`${headingId}-red`} size={200}>
              {`${redNoticeWords.description} ${settings.data.redLockedReason}`}
            </Text>
          </li>
        </ul>
      )}
      {save.isError && (
        <div role="alert">
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>{describeProblem(save.error, 'saving your notice settings')}</MessageBarBody>
          </MessageBar>
        </div>
      )}
      {saved && !save.isPending && (
        <Text role="status" size={200}>
          Saved. The next notices follow your choice.
        </Text>
      )}
    </section>
  );
}
