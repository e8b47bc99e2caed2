import {
  Link,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Spinner,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useQuery } from '@tanstack/react-query';
import { sketchRenderQueryOptions } from '@/api/resources/review';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalS },
  // The picture is drawn on white paper in both themes (it is the one that goes into reports).
  frame: {
    alignSelf: 'flex-start',
    maxWidth: '100%',
    backgroundColor: '#ffffff',
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusMedium,
    padding: tokens.spacingHorizontalXS,
  },
  image: { display: 'block', maxWidth: '100%', maxHeight: '70vh', height: 'auto' },
  link: { minHeight: `${TOUCH_TARGET_PX}px`, display: 'inline-flex', alignItems: 'center' },
});

/**
 * The sketch as the geologist submitted it, read-only: the picture the API renders from the frozen
 * revision (the same one reports and handovers use). Nothing is shown when no submit had a sketch.
 */
export function SubmittedSketch({ projectId, roundId }: { projectId: string; roundId: string }) {
  const styles = useStyles();
  const { data, isPending, error } = useQuery(sketchRenderQueryOptions(projectId, roundId));
  if (isPending) return null;
  if (error)
    return (
      <MessageBar intent="warning">
        <MessageBarBody>{`The submitted sketch could not be read: ${error.message}`}</MessageBarBody>
      </MessageBar>
    );
  if (data === null) return null;
  return (
    <section className={styles.root} aria-label="Sketch as submitted" data-testid="submitted-sketch">
      <Subtitle2 as="h3">{`Sketch as submitted (revision ${data.revision})`}</Subtitle2>
      {data.state === 'rendering' || data.pngUrl === null ? (
        <Spinner size="small" label="The picture of the sketch is being made…" />
      ) : (
        <>
          <div className={styles.frame}>
            <img
              className={styles.image}
              src={data.pngUrl}
              alt={`The face sketch of revision ${data.revision}, drawn to scale on the heading's profile`}
            />
          </div>
          {data.svgUrl && (
            <Link className={styles.link} href={data.svgUrl} target="_blank" rel="noreferrer">
              Open the sketch as SVG (for reports)
            </Link>
          )}
        </>
      )}
    </section>
  );
}
