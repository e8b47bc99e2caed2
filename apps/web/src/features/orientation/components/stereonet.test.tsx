import { fireEvent, screen } from '@testing-library/react';
import { PICK_REACH_PX, Stereonet } from '@/features/orientation/components/stereonet';
import { buildStereonetScene } from '@/features/orientation/scene/stereonet-scene';
import { renderWithProviders } from '@/testing/render-with-providers';

const scene = buildStereonetScene(
  [
    { id: 'a', kind: 'joint', plane: { dipDirection: 130, dip: 50 }, set: null },
    { id: 'b', kind: 'fault', plane: { dipDirection: 300, dip: 20 }, set: null },
  ],
  [],
  { size: 400 },
);

// jsdom has no PointerEvent: without one the event loses its coordinates.
if (!('PointerEvent' in window)) {
  class TestPointerEvent extends MouseEvent {
    pointerType: string;
    constructor(type: string, init: PointerEventInit = {}) {
      super(type, init);
      this.pointerType = init.pointerType ?? '';
    }
  }
  Object.assign(window, { PointerEvent: TestPointerEvent });
}

// jsdom lays nothing out: the svg's box is 0 wide, so screen px equal scene px here.
describe('Stereonet', () => {
  it('picks the pole under a tap within the touch reach, and nothing farther away', () => {
    const onPick = jest.fn();
    renderWithProviders(<Stereonet scene={scene} selectedId={null} onPick={onPick} />);
    const svg = screen.getByRole('img', { name: /2 poles/ });
    const a = scene.poles[0];
    fireEvent.pointerDown(svg, { clientX: a.x + PICK_REACH_PX - 2, clientY: a.y, pointerType: 'touch' });
    expect(onPick).toHaveBeenLastCalledWith(expect.objectContaining({ id: 'a' }));
    fireEvent.pointerDown(svg, { clientX: a.x + PICK_REACH_PX + 3, clientY: a.y, pointerType: 'touch' });
    expect(onPick).toHaveBeenLastCalledWith(null);
    expect(PICK_REACH_PX * 2).toBeGreaterThanOrEqual(44);
  });

  it('steps through the poles with the arrow keys and lets go with Escape', () => {
    const onPick = jest.fn();
    const { rerender } = renderWithProviders(<Stereonet scene={scene} selectedId="a" onPick={onPick} />);
    const svg = screen.getByRole('img', { name: /2 poles/ });
    expect(svg.querySelector('[data-role="selected-pole"]')?.getAttribute('cx')).toBe(
      String(scene.poles[0].x),
    );
    fireEvent.keyDown(svg, { key: 'ArrowRight' });
    expect(onPick).toHaveBeenLastCalledWith(expect.objectContaining({ id: 'b' }));
    fireEvent.keyDown(svg, { key: 'Escape' });
    expect(onPick).toHaveBeenLastCalledWith(null);
    rerender(<Stereonet scene={scene} selectedId={null} onPick={onPick} />);
  });
});
