import { sceneToSvg } from '@/features/orientation/scene/scene-svg';
import type { StereonetScene } from '@/features/orientation/scene/stereonet-scene';
import { saveBlob } from '@/lib/save-blob';

/** Saves the scene as an SVG file (the same scene code the screen draws, with print colours). */
export function downloadSvg(scene: StereonetScene, background: string, fileName: string): void {
  saveBlob(new Blob([sceneToSvg(scene, { background })], { type: 'image/svg+xml' }), fileName);
}

/** Saves the scene as a PNG: the SVG file drawn onto a canvas at twice its size. */
export async function downloadPng(
  scene: StereonetScene,
  background: string,
  fileName: string,
): Promise<void> {
  const svg = sceneToSvg(scene, { background });
  const image = new Image();
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The stereonet could not be drawn as a picture.'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(scene.width * 2);
    canvas.height = Math.round(scene.height * 2);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw pictures for download.');
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The PNG could not be made.');
    saveBlob(blob, fileName);
  } finally {
    URL.revokeObjectURL(url);
  }
}
