import { makeStyles, tokens } from '@fluentui/react-components';
import { profileShapeLabels } from '@/features/headings/utils/labels';
import type { ProfileSize } from '@/features/headings/utils/profile-outline';
import { profileOutline } from '@/features/headings/utils/profile-outline';

export interface ProfilePreviewProps extends Partial<ProfileSize> {
  /** Height of the tunnel axis above the invert, metres (drawn as a dashed line). */
  axisHeight?: number;
}

const useStyles = makeStyles({
  figure: {
    margin: 0,
    padding: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
  },
  svg: { display: 'block', width: '100%', height: 'auto', maxHeight: '26rem' },
  grid: { stroke: tokens.colorNeutralStroke2 },
  outline: { fill: tokens.colorBrandBackground2, stroke: tokens.colorBrandForeground1 },
  axis: { stroke: tokens.colorPaletteDarkOrangeForeground1 },
  dimension: { stroke: tokens.colorNeutralForeground2 },
  text: { fill: tokens.colorNeutralForeground1, fontFamily: tokens.fontFamilyBase },
  caption: { marginTop: tokens.spacingVerticalS, color: tokens.colorNeutralForeground2 },
  empty: {
    minHeight: '12rem',
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'center',
    color: tokens.colorNeutralForeground3,
    textAlign: 'center',
  },
});

const metres = (n: number) => `${Number(n.toFixed(2))} m`;

function usable(n: number | undefined): n is number {
  return n !== undefined && Number.isFinite(n) && n > 0 && n <= 40;
}

/** The excavation profile to scale on a 1 m grid, with its width, height and axis. */
export function ProfilePreview({ shape, width, height, axisHeight }: ProfilePreviewProps) {
  const styles = useStyles();
  if (shape === undefined || !usable(width) || !usable(height)) {
    return (
      <figure className={styles.figure} aria-label="Profile preview">
        <div className={styles.empty}>
          The preview appears once the shape, width and height are filled in.
        </div>
      </figure>
    );
  }
  const drawnHeight = shape === 'circular' ? width : height;
  const half = width / 2;
  const size = Math.max(width, drawnHeight);
  const pad = Math.max(0.8, size * 0.12);
  const font = Math.max(0.3, size * 0.045);
  const line = size / 250;
  const axisShown =
    axisHeight !== undefined && Number.isFinite(axisHeight) && axisHeight >= 0 && axisHeight <= drawnHeight;
  // The axis label sits left of the dashed line's end, outside the outline; room is made for it.
  const axisFont = font * 0.85;
  const axisLabel = axisShown ? `axis ${metres(axisHeight)}` : '';
  const axisLineStart = -half - pad / 3;
  const axisLabelEnd = axisLineStart - axisFont * 0.4;
  const axisLabelStart = axisLabelEnd - axisLabel.length * axisFont * 0.6;
  const gx0 = Math.floor(Math.min(-half - pad / 2, axisShown ? axisLabelStart : 0));
  const gx1 = Math.ceil(half + pad / 2);
  const gy1 = Math.ceil(drawnHeight + pad / 2);
  const gy0 = Math.min(0, Math.floor(-pad / 2));
  const verticals: number[] = [];
  for (let x = gx0; x <= gx1; x += 1) verticals.push(x);
  const horizontals: number[] = [];
  for (let y = gy0; y <= gy1; y += 1) horizontals.push(y);

  // Screen coordinates: x as drawn, y = −(metres above the invert).
  const minX = gx0 - 0.2;
  const maxX = Math.max(gx1, half + pad * 0.5 + font * 7.5);
  const minY = -gy1 - 0.2;
  const maxY = Math.max(-gy0, pad + font * 1.5);
  const label = `${profileShapeLabels[shape]} profile, ${metres(width)} wide and ${metres(drawnHeight)} high, to scale on a 1 m grid`;

  return (
    <figure className={styles.figure} aria-label="Profile preview">
      <svg
        className={styles.svg}
        viewBox={`${minX} ${minY} ${maxX - minX} ${maxY - minY}`}
        role="img"
        aria-label={label}
        data-shape={shape}
      >
        <g className={styles.grid} strokeWidth={line} data-testid="profile-grid">
          {verticals.map((x) => (
            <line key={`v${x}`} x1={x} x2={x} y1={-gy1} y2={-gy0} data-grid="vertical" />
          ))}
          {horizontals.map((y) => (
            <line key={`h${y}`} x1={gx0} x2={gx1} y1={-y} y2={-y} data-grid="horizontal" />
          ))}
        </g>
        <g transform="scale(1,-1)">
          <path
            className={styles.outline}
            d={profileOutline({ shape, width, height: drawnHeight })}
            strokeWidth={line * 3}
            fillOpacity={0.6}
            data-testid="profile-outline"
          />
          {axisShown && (
            <line
              className={styles.axis}
              x1={axisLineStart}
              x2={half + pad / 3}
              y1={axisHeight}
              y2={axisHeight}
              strokeWidth={line * 2}
              strokeDasharray={`${line * 8} ${line * 5}`}
              data-testid="profile-axis"
            />
          )}
        </g>
        {/* Width below the invert, height to the right. */}
        <g className={styles.dimension} strokeWidth={line * 1.5}>
          <line x1={-half} x2={half} y1={pad * 0.45} y2={pad * 0.45} />
          <line x1={-half} x2={-half} y1={pad * 0.25} y2={pad * 0.65} />
          <line x1={half} x2={half} y1={pad * 0.25} y2={pad * 0.65} />
          <line x1={half + pad * 0.5} x2={half + pad * 0.5} y1={0} y2={-drawnHeight} />
          <line x1={half + pad * 0.3} x2={half + pad * 0.7} y1={0} y2={0} />
          <line x1={half + pad * 0.3} x2={half + pad * 0.7} y1={-drawnHeight} y2={-drawnHeight} />
        </g>
        <text className={styles.text} x={0} y={pad * 0.45 + font * 1.2} fontSize={font} textAnchor="middle">
          {`width ${metres(width)}`}
        </text>
        <text
          className={styles.text}
          x={half + pad * 0.5 + font * 0.4}
          y={-drawnHeight / 2}
          fontSize={font}
          dominantBaseline="middle"
        >
          {`height ${metres(drawnHeight)}`}
        </text>
        {axisShown && (
          <text
            className={styles.text}
            x={axisLabelEnd}
            y={-axisHeight}
            fontSize={axisFont}
            textAnchor="end"
            dominantBaseline="middle"
            data-testid="profile-axis-label"
          >
            {axisLabel}
          </text>
        )}
      </svg>
      <figcaption
        className={styles.caption}
      >{`${profileShapeLabels[shape]}; grid lines every 1 m.`}</figcaption>
    </figure>
  );
}
