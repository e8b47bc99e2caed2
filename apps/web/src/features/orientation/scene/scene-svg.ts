// Writes a stereonet scene as a standalone SVG document (the download, and later the server's PDFs).
import type { SceneNode, SceneStyle, StereonetScene } from './stereonet-scene';

const esc = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

const n = (v: number): string => String(Math.round(v * 100) / 100);

function styleAttrs(s: SceneStyle): string {
  const a: string[] = [];
  a.push(`fill="${esc(s.fill ?? 'none')}"`);
  if (s.stroke) a.push(`stroke="${esc(s.stroke)}"`);
  if (s.width !== undefined) a.push(`stroke-width="${n(s.width)}"`);
  if (s.dash) a.push(`stroke-dasharray="${esc(s.dash)}"`);
  if (s.opacity !== undefined) a.push(`opacity="${n(s.opacity)}"`);
  if (s.fillOpacity !== undefined) a.push(`fill-opacity="${n(s.fillOpacity)}"`);
  if (s.fillRule) a.push(`fill-rule="${s.fillRule}"`);
  return a.join(' ');
}

function node(x: SceneNode, clipId: string): string {
  switch (x.type) {
    case 'circle':
      return `<circle data-role="${esc(x.role)}" cx="${n(x.cx)}" cy="${n(x.cy)}" r="${n(x.r)}" ${styleAttrs(x)}/>`;
    case 'path':
      return x.d ? `<path data-role="${esc(x.role)}" d="${esc(x.d)}" ${styleAttrs(x)}/>` : '';
    case 'text':
      return `<text data-role="${esc(x.role)}" x="${n(x.x)}" y="${n(x.y)}" font-size="${n(x.size)}" fill="${esc(x.fill)}" text-anchor="${x.anchor}"${x.weight ? ` font-weight="${x.weight}"` : ''}${x.halo ? ` stroke="${esc(x.halo)}" stroke-width="${n(x.size / 5)}" paint-order="stroke"` : ''}>${esc(x.text)}</text>`;
    case 'group':
      return `<g data-role="${esc(x.role)}"${x.clip ? ` clip-path="url(#${clipId})"` : ''}>${x.children.map((c) => node(c, clipId)).join('')}</g>`;
  }
}

/** The scene as an SVG file's text, with its own clip path and a background in the paper colour. */
export function sceneToSvg(
  scene: StereonetScene,
  options: { background: string; fontFamily?: string; clipId?: string },
): string {
  const clipId = options.clipId ?? 'rb-net-clip';
  const font = options.fontFamily ?? "'Open Sans', 'Segoe UI', sans-serif";
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(scene.width)}" height="${n(scene.height)}" viewBox="0 0 ${n(scene.width)} ${n(scene.height)}" font-family="${esc(font)}" role="img">`,
    `<title>${esc(scene.title)}</title>`,
    `<defs><clipPath id="${clipId}"><circle cx="${n(scene.centre.x)}" cy="${n(scene.centre.y)}" r="${n(scene.radius)}"/></clipPath></defs>`,
    `<rect width="100%" height="100%" fill="${esc(options.background)}"/>`,
    ...scene.nodes.map((x) => node(x, clipId)),
    '</svg>',
  ].join('');
}
