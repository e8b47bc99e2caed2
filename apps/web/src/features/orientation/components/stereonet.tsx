import { makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import type { KeyboardEvent, PointerEvent, ReactNode } from 'react';
import { useId, useRef, useState } from 'react';
import type {
  DrawnLine,
  DrawnPole,
  ScenePoint,
  SceneNode,
  StereonetScene,
} from '@/features/orientation/scene/stereonet-scene';
import { nearestLine, nearestPole, polesInLasso } from '@/features/orientation/scene/stereonet-scene';

/** Reach of a tap or hover around a pole, screen px (a 44 px touch target). */
export const PICK_REACH_PX = 22;
/**
 * A press that travels further than this (screen px) before it is let go is a lasso, not a tap: more than
 * a gloved finger wobbles on a tap, less than the smallest loop worth drawing.
 */
export const LASSO_START_PX = 16;

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
  // While choosing poles a drag draws the lasso instead of scrolling the page or selecting the labels.
  choosing: { touchAction: 'none', userSelect: 'none', WebkitUserSelect: 'none' },
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
  /**
   * Choosing poles (an editable round): a tap toggles the pole under it, a drag draws a free lasso that
   * adds the poles inside it, and Space or Enter toggles the pole being read. Absent: no choosing.
   */
  choosing?: {
    ids: ReadonlySet<string>;
    onToggle: (id: string) => void;
    onLasso: (ids: string[]) => void;
  } | null;
}

/**
 * Draws a stereonet scene as inline SVG. Tap or click near a pole (within 22 px) to read it; with a mouse,
 * hovering reads it too. With the keyboard, the arrow keys step through the poles and Escape lets go.
 * While choosing poles, a tap toggles one and a drag (finger, pen or mouse) draws a lasso around several.
 */
export function Stereonet({ scene, selectedId, onPick, onPickLine, choosing = null }: StereonetProps) {
  const styles = useStyles();
  const clip = `net-clip-${useId().replace(/:/g, '')}`;
  const svgRef = useRef<SVGSVGElement>(null);
  // The press being drawn while choosing: its pointer, the points so far and whether it is a lasso yet.
  const press = useRef<{ pointer: number; points: ScenePoint[]; travel: number; lasso: boolean } | null>(
    null,
  );
  const [lasso, setLasso] = useState<ScenePoint[] | null>(null);
  const selected =
    selectedId === null
      ? null
      : (scene.poles.find((p) => p.id === selectedId) ??
        scene.lines.find((l) => l.id === selectedId) ??
        null);

  /** The pointer's place in the scene's coordinates, and scene px per screen px. */
  const toScene = (e: PointerEvent<SVGSVGElement>) => {
    const box = svgRef.current?.getBoundingClientRect();
    const scale = box && box.width > 0 ? scene.width / box.width : 1;
    return {
      x: (e.clientX - (box?.left ?? 0)) * scale,
      y: (e.clientY - (box?.top ?? 0)) * scale,
      scale,
    };
  };
  const pick = (e: PointerEvent<SVGSVGElement>, hover: boolean) => {
    if (!svgRef.current) return;
    const { x, y, scale } = toScene(e);
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
  const startChoosing = (e: PointerEvent<SVGSVGElement>) => {
    const { x, y } = toScene(e);
    press.current = { pointer: e.pointerId, points: [{ x, y }], travel: 0, lasso: false };
    // Keep the pointer's moves while it is down, even off the net (not every engine has capture).
    e.currentTarget.setPointerCapture?.(e.pointerId);
  };
  const moveChoosing = (e: PointerEvent<SVGSVGElement>) => {
    const p = press.current;
    if (!p || p.pointer !== e.pointerId) return false;
    const { x, y, scale } = toScene(e);
    const last = p.points[p.points.length - 1];
    const step = Math.hypot(x - last.x, y - last.y);
    if (step < 2 * scale) return true;
    p.points.push({ x, y });
    p.travel += step;
    if (!p.lasso && p.travel > LASSO_START_PX * scale) p.lasso = true;
    if (p.lasso) setLasso([...p.points]);
    return true;
  };
  const endChoosing = (e: PointerEvent<SVGSVGElement>) => {
    const p = press.current;
    press.current = null;
    setLasso(null);
    if (!choosing || !p || p.pointer !== e.pointerId) return;
    if (p.lasso) {
      const inside = polesInLasso(scene, p.points);
      if (inside.length > 0) choosing.onLasso(inside.map((q) => q.id));
      return;
    }
    const { x, y, scale } = toScene(e);
    const hit = nearestPole(scene, x, y, PICK_REACH_PX * scale);
    if (hit) {
      choosing.onToggle(hit.id);
      onPick(hit);
    }
  };
  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>) => {
    if (scene.poles.length === 0) return;
    const at = selected && 'index' in selected ? selected.index : -1;
    if (choosing && (e.key === ' ' || e.key === 'Enter')) {
      e.preventDefault();
      if (selected && 'index' in selected) choosing.onToggle(selected.id);
      return;
    }
    if (e.key === 'ArrowRight' || e.key === 'ArrowDown') {
      e.preventDefault();
      onPick(scene.poles[(at + 1) % scene.poles.length]);
    } else if (e.key === 'ArrowLeft' || e.key === 'ArrowUp') {
      e.preventDefault();
      onPick(scene.poles[(at - 1 + scene.poles.length) % scene.poles.length]);
    } else if (e.key === 'Escape') onPick(null);
  };
  const ring = Math.max(8, scene.width * 0.025);
  const chosen = choosing ? scene.poles.filter((p) => choosing.ids.has(p.id)) : [];
  return (
    <svg
      ref={svgRef}
      className={mergeClasses(styles.svg, choosing ? styles.choosing : undefined)}
      viewBox={`0 0 ${scene.width} ${scene.height}`}
      role="img"
      aria-label={scene.title}
      tabIndex={0}
      data-net={scene.net}
      data-choosing={choosing ? 'true' : undefined}
      onPointerDown={(e) => (choosing ? startChoosing(e) : pick(e, false))}
      onPointerMove={(e) => {
        if (choosing && moveChoosing(e)) return;
        if (e.pointerType === 'mouse') pick(e, true);
      }}
      onPointerUp={choosing ? endChoosing : undefined}
      onPointerCancel={
        choosing
          ? () => {
              press.current = null;
              setLasso(null);
            }
          : undefined
      }
      onKeyDown={onKeyDown}
    >
      <title>{scene.title}</title>
      <defs>
        <clipPath id={clip}>
          <circle cx={scene.centre.x} cy={scene.centre.y} r={scene.radius} />
        </clipPath>
      </defs>
      {scene.nodes.map((n, i) => render(n, String(i), clip))}
      {chosen.length > 0 && (
        <g data-role="chosen-poles">
          {chosen.map((p) => (
            <circle
              key={p.id}
              data-role="chosen-pole"
              data-id={p.id}
              cx={p.x}
              cy={p.y}
              r={ring * 0.8}
              fill={tokens.colorBrandBackground}
              fillOpacity={0.22}
              stroke={tokens.colorBrandForeground1}
              strokeWidth={Math.max(2.5, scene.width / 160)}
            />
          ))}
        </g>
      )}
      {lasso && lasso.length > 1 && (
        <path
          data-role="lasso"
          d={`${lasso.map((q, i) => `${i === 0 ? 'M' : 'L'}${q.x.toFixed(1)} ${q.y.toFixed(1)}`).join(' ')} Z`}
          fill={tokens.colorBrandBackground}
          fillOpacity={0.08}
          stroke={tokens.colorBrandForeground1}
          strokeWidth={Math.max(2, scene.width / 220)}
          strokeDasharray="6 4"
          pointerEvents="none"
        />
      )}
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
