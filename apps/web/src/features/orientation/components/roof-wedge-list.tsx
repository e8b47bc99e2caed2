import { Caption1, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import type { RoofWedgeFinding, WedgeSet } from '@roundbook/domain';
import { formatDipDirectionDip, roofWedgesOfSets } from '@roundbook/domain';
import type { Line } from '@roundbook/geomath';
import { useMemo } from 'react';

export interface RoofWedgeListProps {
  /** The sets (label and Fisher mean) of the round or the stretch. */
  sets: readonly WedgeSet[];
  /** Friction angle of the joints, degrees. */
  frictionAngle: number;
  /** "this round" or "this stretch", for the sentences. */
  scope: string;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalXL },
  note: { color: tokens.colorNeutralForeground2 },
});

const line = (l: Line) => formatDipDirectionDip({ dipDirection: l.trend, dip: l.plunge });

function describe(w: RoofWedgeFinding, frictionAngle: number): string {
  const sets = `${w.labels[0]}, ${w.labels[1]} and ${w.labels[2]}`;
  const edges = `edges ${w.edges.map(line).join(', ')}`;
  if (w.mode === 'falls' || w.sliding === null)
    return `${sets}: falls straight down (the vertical lies between its three edges; ${edges}).`;
  const on =
    w.sliding.on.kind === 'line'
      ? `along the line where ${w.sliding.on.labels[0]} and ${w.sliding.on.labels[1]} meet`
      : `on ${w.sliding.on.labels[0]} alone, down its dip`;
  return `${sets}: slides ${on}, ${line(w.sliding.direction)}, steeper than φ ${frictionAngle}° (${edges}).`;
}

/**
 * Every roof wedge closed off by three of the sets (their means) that falls or slides, from geomath's
 * roofWedge through packages/domain roofWedgesOfSets; says so when none does or when there are fewer than
 * three sets.
 */
export function RoofWedgeList({ sets, frictionAngle, scope }: RoofWedgeListProps) {
  const styles = useStyles();
  const summary = useMemo(() => roofWedgesOfSets(sets, frictionAngle), [sets, frictionAngle]);
  let body;
  if (summary.setCount < 3)
    body = (
      <Caption1>{`Fewer than three sets in ${scope} (${summary.setCount}): no three-set roof wedge to check.`}</Caption1>
    );
  else if (summary.wedges.length === 0)
    body = (
      <Caption1>{`None of the ${summary.combinations} combination${summary.combinations === 1 ? '' : 's'} of three sets closes off a roof wedge that falls or slides at φ ${frictionAngle}°.`}</Caption1>
    );
  else
    body = (
      <ul className={styles.list} aria-label="Roof wedges that fall or slide">
        {summary.wedges.map((w) => (
          <li key={w.labels.join('-')}>{describe(w, frictionAngle)}</li>
        ))}
      </ul>
    );
  return (
    <section className={styles.root} aria-label="Roof wedges of three sets">
      <Subtitle2 as="h3">Roof wedges of three sets</Subtitle2>
      {summary.setCount >= 3 && (
        <Caption1 className={styles.note}>
          {`Every combination of three set means of ${scope} under a level roof, friction angle φ ${frictionAngle}°` +
            (summary.noWedge > 0
              ? `; ${summary.noWedge} of the ${summary.combinations} close off no wedge (two sets parallel or an edge level).`
              : '.')}
        </Caption1>
      )}
      {body}
    </section>
  );
}
