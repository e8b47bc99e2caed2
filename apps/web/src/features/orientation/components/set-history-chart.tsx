import {
  Caption1,
  makeStyles,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  ToggleButton,
  tokens,
} from '@fluentui/react-components';
import { TableRegular } from '@fluentui/react-icons';
import { formatPlane } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { useId, useMemo, useState } from 'react';
import { screenPalette } from '@/features/orientation/components/screen-palette';
import { setColour } from '@/features/orientation/scene/palette';
import { chainageTicks } from '@/features/orientation/scene/set-history';
import type { SetHistory } from '@/features/orientation/scene/set-history';
import { setShape, shapePath } from '@/features/orientation/scene/symbols';

export interface SetHistoryChartProps {
  history: readonly SetHistory[];
  /** The window's chainages (the x axis spans them). */
  fromChainage: number;
  toChainage: number;
  /** A chainage in the heading's style (km+m). */
  chainage: (m: number) => string;
  highContrast: boolean;
}

/** viewBox of the chart; CSS scales it to the column. */
const W = 340;
const LEFT = 40;
const RIGHT = 12;
const PANEL = 96;
const TOP = 20;
const GAP = 40;
const BOTTOM = 30;
const H = TOP + PANEL + GAP + PANEL + BOTTOM;
const FONT = 10;

/** The two panels: dip direction over the whole circle, dip from level to vertical. */
const PANELS = [
  { key: 'dipDirection', title: 'Mean dip direction', max: 360, ticks: [0, 90, 180, 270, 360], top: TOP },
  { key: 'dip', title: 'Mean dip', max: 90, ticks: [0, 30, 60, 90], top: TOP + PANEL + GAP },
] as const;

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  svg: {
    display: 'block',
    width: '100%',
    height: 'auto',
    maxWidth: '30rem',
    fontFamily: tokens.fontFamilyBase,
  },
  notes: { color: tokens.colorNeutralForeground2 },
  key: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  keyItem: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
  big: { minHeight: `${TOUCH_TARGET_PX}px`, alignSelf: 'flex-start' },
});

/**
 * Each set's mean along the chainage, beside the heading's net: dip direction above, dip below, one line
 * and symbol per set in the net's colours and shapes; a table of the same figures behind a toggle.
 */
export function SetHistoryChart({
  history,
  fromChainage,
  toChainage,
  chainage,
  highContrast,
}: SetHistoryChartProps) {
  const styles = useStyles();
  const tableId = useId();
  const [asTable, setAsTable] = useState(false);
  const palette = useMemo(() => screenPalette(highContrast), [highContrast]);
  const pad = toChainage > fromChainage ? 0 : 5;
  const x0 = fromChainage - pad;
  const x1 = toChainage + pad;
  const x = (m: number) => LEFT + ((m - x0) / (x1 - x0)) * (W - LEFT - RIGHT);
  const rounds = new Set(history.flatMap((s) => s.points.map((p) => p.roundId))).size;
  const title =
    `Chart of each set's mean along the chainage from ${chainage(fromChainage)} to ${chainage(toChainage)}: ` +
    `${history.length} set${history.length === 1 ? '' : 's'} over ${rounds} round${rounds === 1 ? '' : 's'}`;
  const ticks = chainageTicks(x0, x1);
  const line = 1.6;

  return (
    <section className={styles.root} aria-label="Sets along the chainage">
      <Subtitle2 as="h3">Sets along the chainage</Subtitle2>
      {history.length === 0 ? (
        <Caption1 className={styles.notes}>No round in this window has a set yet.</Caption1>
      ) : (
        <>
          <svg className={styles.svg} viewBox={`0 0 ${W} ${H}`} role="img" aria-label={title}>
            <title>{title}</title>
            {PANELS.map((panel) => {
              const y = (v: number) => panel.top + PANEL - (v / panel.max) * PANEL;
              return (
                <g key={panel.key} data-role={`panel-${panel.key}`}>
                  <text x={LEFT} y={panel.top - 7} fontSize={FONT} fontWeight={700} fill={palette.ink}>
                    {`${panel.title} (°)`}
                  </text>
                  <rect
                    x={LEFT}
                    y={panel.top}
                    width={W - LEFT - RIGHT}
                    height={PANEL}
                    fill={palette.paper}
                    stroke={palette.ink}
                    strokeWidth={1}
                  />
                  {panel.ticks.map((t) => (
                    <g key={t}>
                      <line
                        x1={LEFT}
                        x2={W - RIGHT}
                        y1={y(t)}
                        y2={y(t)}
                        stroke={palette.grid}
                        strokeWidth={0.8}
                      />
                      <text
                        x={LEFT - 4}
                        y={y(t) + FONT * 0.35}
                        fontSize={FONT * 0.9}
                        textAnchor="end"
                        fill={palette.muted}
                      >
                        {panel.key === 'dipDirection' ? String(t).padStart(3, '0') : String(t)}
                      </text>
                    </g>
                  ))}
                  {ticks.map((t) => (
                    <line
                      key={t}
                      x1={x(t)}
                      x2={x(t)}
                      y1={panel.top}
                      y2={panel.top + PANEL}
                      stroke={palette.grid}
                      strokeWidth={0.8}
                    />
                  ))}
                  {history.map((s, i) => {
                    const colour = setColour(palette, i);
                    const values = s.points.map((p) => ({ x: x(p.chainage), v: p.mean[panel.key] }));
                    // A dip direction crossing north (e.g. 350° → 010°) is not drawn as a swing across the panel.
                    let d = '';
                    values.forEach((p, k) => {
                      const jump = k > 0 && Math.abs(p.v - values[k - 1].v) > panel.max / 2;
                      d += `${k === 0 || jump ? 'M' : 'L'}${p.x.toFixed(1)} ${y(p.v).toFixed(1)} `;
                    });
                    return (
                      <g key={s.label} data-role={`history-${s.label}`}>
                        {values.length > 1 && (
                          <path d={d.trim()} fill="none" stroke={colour} strokeWidth={line} />
                        )}
                        {values.map((p, k) => (
                          <path
                            key={k}
                            data-role="history-mean"
                            d={shapePath(setShape(i), p.x, y(p.v), 4.2)}
                            fill={colour}
                            stroke={palette.paper}
                            strokeWidth={1.2}
                          />
                        ))}
                      </g>
                    );
                  })}
                </g>
              );
            })}
            {ticks.map((t) => (
              <text
                key={t}
                x={x(t)}
                y={H - BOTTOM + FONT * 1.3}
                fontSize={FONT * 0.9}
                textAnchor="middle"
                fill={palette.muted}
              >
                {chainage(t)}
              </text>
            ))}
            <text x={W - RIGHT} y={H - 4} fontSize={FONT * 0.9} textAnchor="end" fill={palette.ink}>
              Chainage (face of each round)
            </text>
          </svg>
          <div className={styles.key} aria-label="Sets in the chart">
            {history.map((s, i) => (
              <span key={s.label} className={styles.keyItem}>
                <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true">
                  <path
                    d={shapePath(setShape(i), 10, 10, 6)}
                    fill={setColour(palette, i)}
                    stroke={palette.paper}
                    strokeWidth={1.2}
                  />
                </svg>
                {s.label}
              </span>
            ))}
          </div>
          <Caption1 className={styles.notes}>
            Each point: the Fisher mean of one round&apos;s joints in the set, by the label the round gave
            them (labels are each round&apos;s own, not yet matched along the heading).
          </Caption1>
          <ToggleButton
            className={styles.big}
            icon={<TableRegular />}
            checked={asTable}
            aria-expanded={asTable}
            aria-controls={asTable ? tableId : undefined}
            onClick={() => setAsTable((t) => !t)}
          >
            {asTable ? 'Hide the table' : 'Show as a table'}
          </ToggleButton>
          {asTable && (
            <Table id={tableId} aria-label="Sets along the chainage" size="small">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Set</TableHeaderCell>
                  <TableHeaderCell>Round</TableHeaderCell>
                  <TableHeaderCell>Chainage</TableHeaderCell>
                  <TableHeaderCell>Mean plane</TableHeaderCell>
                  <TableHeaderCell>Joints</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {history.flatMap((s) =>
                  s.points.map((p) => (
                    <TableRow key={`${s.label}-${p.roundId}`}>
                      <TableCell>{s.label}</TableCell>
                      <TableCell>{p.roundNumber}</TableCell>
                      <TableCell>{chainage(p.chainage)}</TableCell>
                      <TableCell>{formatPlane(p.mean)}</TableCell>
                      <TableCell>{p.count}</TableCell>
                    </TableRow>
                  )),
                )}
              </TableBody>
            </Table>
          )}
        </>
      )}
    </section>
  );
}
