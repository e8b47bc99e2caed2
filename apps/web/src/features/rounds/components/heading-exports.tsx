import { Button, MessageBar, MessageBarBody, makeStyles, tokens } from '@fluentui/react-components';
import { ArrowDownloadRegular } from '@fluentui/react-icons';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useMutation } from '@tanstack/react-query';
import { fetchBlob, isApiError } from '@/lib/api-client';
import { saveBlob } from '@/lib/save-blob';

const useStyles = makeStyles({
  root: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  button: { minHeight: `${TOUCH_TARGET_PX}px` },
});

export type HeadingExportKind = 'rounds' | 'joints';

export function exportPath(projectId: string, headingId: string, kind: HeadingExportKind): string {
  return `/api/projects/${encodeURIComponent(projectId)}/headings/${encodeURIComponent(headingId)}/exports/${kind}.csv`;
}

/** Fetches the CSV with the bearer token and hands it to the browser as a download. */
async function download(path: string, fileName: string): Promise<void> {
  saveBlob(await fetchBlob(path), fileName);
}

export interface HeadingExportsProps {
  projectId: string;
  heading: { id: string; code: string };
}

/** The heading's rounds and joints as CSV files (every round, whatever the table's filters). */
export function HeadingExports({ projectId, heading }: HeadingExportsProps) {
  const styles = useStyles();
  const mutation = useMutation({
    mutationKey: ['exports', heading.id],
    mutationFn: (kind: HeadingExportKind) =>
      download(exportPath(projectId, heading.id, kind), `${heading.code}-${kind}.csv`),
  });
  const failed = mutation.error;
  return (
    <div className={styles.root} role="group" aria-label="Export">
      <Button
        className={styles.button}
        size="large"
        icon={<ArrowDownloadRegular />}
        disabled={mutation.isPending}
        onClick={() => mutation.mutate('rounds')}
      >
        Rounds as CSV
      </Button>
      <Button
        className={styles.button}
        size="large"
        icon={<ArrowDownloadRegular />}
        disabled={mutation.isPending}
        onClick={() => mutation.mutate('joints')}
      >
        Joints as CSV
      </Button>
      {failed !== null && (
        <MessageBar intent="error" data-testid="export-error">
          <MessageBarBody>
            {`The file could not be made. ${isApiError(failed) ? failed.message : 'Try again.'}`}
          </MessageBarBody>
        </MessageBar>
      )}
    </div>
  );
}
