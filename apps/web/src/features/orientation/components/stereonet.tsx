import { makeStyles, tokens } from '@fluentui/react-components';
import type { KeyboardEvent, PointerEvent, ReactNode } from 'react';
import { useId, useRef } from 'react';
import type {
  DrawnLine,
  DrawnPole,
  SceneNode,
  StereonetScene,
} from '@/features/orientation/scene/stereonet-scene';
import { nearestLine, nearestPole } from '@/features/orientation/scene/stereonet-scene';

/** Reach of a tap or hover around a pole, screen px (a 44 px touch target). */
export const PICK_REACH_PX = 22;

const useStyles = makeStyles({
  svg: {
    display: 'block',
    width: '100%',
    height: 'auto',
    maxWidth: '40rem',
    touchAction: 'manipulation',
    fontFamily: tokens.fontFamilyBase,
    cursor: 'crosshair',
    ':focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
  },
});

function render(node: SceneNode, key: string, clip: string): ReactNode {
  switch (node.type) {
    case 'circle':
      return (
        <circle
          key={key}
          data-role={node.role}
          cx={node.cx}
          cy={node.cy}
          r={node.r}
          fill={node.fill ?? 'none'}
          stroke={node.stroke}
          strokeWidth={node.width}
          strokeDasharray={node.dash}
        />
      );
    case 'path':
      return node.d ? (
        <path
          key={key}
          data-role={node.role}
          d={node.d}
          fill={node.fill ?? 'none'}
          fillOpacity={node.fillOpacity}
          fillRule={node.fillRule}
          opacity={node.opacity}
          stroke={node.stroke}
          strokeWidth={node.width}
          strokeDasharray={node.dash}
        />
      ) : null;
    case 'text':
      return (
        <text
          key={key}
          data-role={node.role}
          x={node.x}
          y={node.y}
          fontSize={node.size}
          fill={node.fill}
          textAnchor={node.anchor}
          fontWeight={node.weight}
          stroke={node.halo}
          strokeWidth={node.halo ? node.size / 5 : undefined}
          paintOrder={node.halo ? 'stroke' : undefined}
        >
          {node.text}
        </text>
      );
    case 'group':
      return (
        <g key={key} data-role={node.role} clipPath={node.clip ? `url(#${clip})` : undefined}>
          {node.children.map((c, i) => render(c, `${key}.${i}`, clip))}
        </g>
      );
  }
}

export interface StereonetProps {
  scene: StereonetScene;
  /** The pole being read (drawn with a ring), or null. */
  selectedId: string | null;
  /** A tap, click or hover near a pole (null: nowhere near one). */
  onPick: (pole: DrawnPole | null) => void;
  /** A tap or hover nearer an intersection mark than any pole (its id is then the selected id). */
  onPickLine?: (line: DrawnLine) => void;
}

/**
 * Draws a stereonet scene as inline SVG. Tap or click near a pole (within 22 px) to read it; with a mouse,
 * hovering reads it too. With the keyboard, the arrow keys step through the poles and Escape lets go.
 */
export function Stereonet({ scene, selectedId, onPick, onPickLine }: StereonetProps) {
  const styles = useStyles();
  const clip = `net-clip-${useId().replace(/:/g, '')}`;
  const svgRef = useRef<SVGSVGElement>(null);
  const selected =
    selectedId === null
      ? null
      : (scene.poles.find((p) => p.id === selectedId) ??
        scene.lines.find((l) => l.id === selectedId) ??
        null);

  const pick = (e: PointerEvent<SVGSVGElement>, hover: boolean) => {
    const svg = svgRef.current;
    if (!svg) return;
    const box = svg.getBoundingClientRect();
    const scale = box.width > 0 ? scene.width / box.width : 1;
    const x = (e.clientX - box.left) * scale;
    const y = (e.clientY - box.top) * scale;
    const hit = nearestPole(scene, x, y, PICK_REACH_PX * scale);
    const mark = onPickLine ? nearestLine(scene, x, y, PICK_REACH_PX * scale) : null;
    if (
      mark &&
      onPickLine &&
      (hit === null || Math.hypot(mark.x - x, mark.y - y) < Math.hypot(hit.x - x, hit.y - y))
    ) {
      onPickLine(mark);
      return;
    }
    if (hover && hit === null) return;
    onPick(hit);
  };
  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>) => {
    if (scene.poles.length === 0) return;
    const at = selected && 'index' in selected ? selected.index : -1;
    if (e.key === 'ArrowRight' || e.key === 'ArrowDown') {
      e.preventDefault();
      onPick(scene.poles[(at + 1) % scene.poles.length]);
    } else if (e.key === 'ArrowLeft' || e.key === 'ArrowUp') {
      e.preventDefault();
      onPick(scene.poles[(at - 1 + scene.poles.length) % scene.poles.length]);
    } else if (e.key === 'Escape') onPick(null);
  };
  const ring = Math.max(8, scene.width * 0.025);
  return (
    <svg
      ref={svgRef}
      className={styles.svg}
      viewBox={`0 0 ${scene.width} ${scene.height}`}
      role="img"
      aria-label={scene.title}
      tabIndex={0}
      data-net={scene.net}
      onPointerDown={(e) => pick(e, false)}
      onPointerMove={(e) => {
        if (e.pointerType === 'mouse') pick(e, true);
      }}
      onKeyDown={onKeyDown}
    >
      <title>{scene.title}</title>
      <defs>
        <clipPath id={clip}>
          <circle cx={scene.centre.x} cy={scene.centre.y} r={scene.radius} />
        </clipPath>
      </defs>
      {scene.nodes.map((n, i) => render(n, String(i), clip))}
      {selected && (
        <circle
          data-role="selected-pole"
          cx={selected.x}
          cy={selected.y}
          r={ring}
          fill="none"
          stroke={tokens.colorStrokeFocus2}
          strokeWidth={Math.max(2, scene.width / 200)}
        />
      )}
    </svg>
  );
}
