import { Button, makeStyles, Spinner, tokens } from '@fluentui/react-components';
import { useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { longSectionQueryOptions, type LongSection } from '@/api/resources/long-sections';
import {
  longSectionScene,
  longSectionSvg,
  type LongSectionPalette,
} from '@/features/long-section/scene/long-section-scene';
import { saveBlob } from '@/lib/save-blob';

const FILE_PALETTE: LongSectionPalette = {
  paper: '#ffffff',
  ink: '#1f2328',
  muted: '#5b6470',
  grid: '#c9ced6',
  tunnel: '#e4e9f0',
  ahead: 'rgba(156, 74, 0, 0.12)',
  trace: '#b3261e',
  bar: '#3a5f8f',
  levels: { green: '#2e8540', amber: '#d98c00', red: '#c62828' },
  units: ['#c8b68a', '#9fb7a0', '#b4a3c7', '#d3a08a', '#9ab3cf', '#c9c27d'],
};

/** On screen: neutrals from the Fluent theme's tokens, so the plot reads in both themes. */
const SCREEN_PALETTE: LongSectionPalette = {
  ...FILE_PALETTE,
  paper: tokens.colorNeutralBackground1,
  ink: tokens.colorNeutralForeground1,
  muted: tokens.colorNeutralForeground3,
  grid: tokens.colorNeutralStroke2,
  tunnel: tokens.colorNeutralBackground3,
  trace: tokens.colorPaletteRedForeground1,
  bar: tokens.colorBrandBackground,
};

const useStyles = makeStyles({
  tools: {
    display: 'flex',
    gap: tokens.spacingHorizontalS,
    flexWrap: 'wrap',
    marginBottom: tokens.spacingVerticalS,
  },
  plot: {
    width: '100%',
    height: 'auto',
    backgroundColor: tokens.colorNeutralBackground1,
    touchAction: 'pan-y',
  },
  clickable: { cursor: 'pointer' },
});

function extentOf(data: LongSection): { from: number; to: number } {
  const all = data.rounds.flatMap((r) => [r.fromChainage, r.faceChainage]);
  for (const t of data.traces)
    for (const c of [t.crownChainage, t.invertChainage]) if (c !== null) all.push(c);
  if (all.length === 0) return { from: 0, to: 100 };
  const from = Math.min(...all);
  const to = Math.max(...all);
  return { from: from - 2, to: to + 2 };
}

export interface LongSectionPlotProps {
  data: LongSection;
  onOpenRound: (roundId: string) => void;
}

/** The long section with zoom and pan along the tunnel; tapping a round opens it. */
export function LongSectionPlot({ data, onOpenRound }: LongSectionPlotProps) {
  const styles = useStyles();
  const full = useMemo(() => extentOf(data), [data]);
  const [view, setView] = useState(full);
  const scene = useMemo(() => longSectionScene(data, view, SCREEN_PALETTE), [data, view]);
  const span = view.to - view.from;
  const zoom = (factor: number) => {
    const mid = (view.from + view.to) / 2;
    const half = Math.max(2, Math.min((full.to - full.from) / 2, (span * factor) / 2));
    setView({ from: mid - half, to: mid + half });
  };
  const pan = (share: number) => setView({ from: view.from + span * share, to: view.to + span * share });
  const save = (kind: 'svg' | 'png') => {
    const file = longSectionScene(data, view, FILE_PALETTE);
    const svg = longSectionSvg(file, FILE_PALETTE.paper);
    if (kind === 'svg') {
      saveBlob(new Blob([svg], { type: 'image/svg+xml' }), 'long-section.svg');
      return;
    }
    const image = new Image();
    const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
    image.onload = () => {
      const canvas = document.createElement('canvas');
      canvas.width = file.width * 2;
      canvas.height = file.height * 2;
      canvas.getContext('2d')?.drawImage(image, 0, 0, canvas.width, canvas.height);
      canvas.toBlob((blob) => {
        URL.revokeObjectURL(url);
        if (blob) saveBlob(blob, 'long-section.png');
      }, 'image/png');
    };
    image.src = url;
  };
  return (
    <div>
      <div className={styles.tools} role="toolbar" aria-label="Long section view">
        <Button size="large" onClick={() => pan(-0.25)}>
          Back along the tunnel
        </Button>
        <Button size="large" onClick={() => pan(0.25)}>
          Forward along the tunnel
        </Button>
        <Button size="large" onClick={() => zoom(0.5)}>
          Closer
        </Button>
        <Button size="large" onClick={() => zoom(2)}>
          Wider
        </Button>
        <Button size="large" onClick={() => setView(full)}>
          Whole heading
        </Button>
        <Button size="large" onClick={() => save('svg')}>
          Save SVG
        </Button>
        <Button size="large" onClick={() => save('png')}>
          Save PNG
        </Button>
      </div>
      <svg
        className={styles.plot}
        viewBox={`0 0 ${scene.width} ${scene.height}`}
        role="img"
        aria-label={`Long section from chainage ${view.from.toFixed(0)} to ${view.to.toFixed(0)}`}
      >
        {scene.nodes.map((d, i) =>
          d.type === 'rect' ? (
            <rect
              key={i}
              x={d.x}
              y={d.y}
              width={d.w}
              height={d.h}
              fill={d.fill}
              data-round-id={d.roundId}
              className={d.roundId ? styles.clickable : undefined}
              onClick={d.roundId ? () => onOpenRound(d.roundId!) : undefined}
            >
              {d.title && <title>{d.title}</title>}
            </rect>
          ) : d.type === 'line' ? (
            <line
              key={i}
              x1={d.x1}
              y1={d.y1}
              x2={d.x2}
              y2={d.y2}
              stroke={d.stroke}
              strokeWidth={d.width}
              strokeDasharray={d.dash}
            />
          ) : (
            <text key={i} x={d.x} y={d.y} fontSize={d.size} fill={d.fill} textAnchor={d.anchor}>
              {d.text}
            </text>
          ),
        )}
      </svg>
    </div>
  );
}

export interface HeadingLongSectionProps {
  projectId: string;
  headingId: string;
}

/** The Long section tab of a heading. */
export function HeadingLongSection({ projectId, headingId }: HeadingLongSectionProps) {
  const navigate = useNavigate();
  const { data, error } = useQuery(longSectionQueryOptions(projectId, headingId));
  if (error) return <p role="alert">The long section could not be read: {error.message}</p>;
  if (!data) return <Spinner label="Reading the long section" />;
  if (data.rounds.length === 0) return <p>No round has been mapped on this heading yet.</p>;
  return (
    <LongSectionPlot data={data} onOpenRound={(id) => void navigate(`/projects/${projectId}/rounds/${id}`)} />
  );
}
