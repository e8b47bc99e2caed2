import { fireEvent, screen } from '@testing-library/react';
import { LASSO_START_PX, PICK_REACH_PX, Stereonet } from '@/features/orientation/components/stereonet';
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

  describe('choosing poles', () => {
    const choosing = () => ({ ids: new Set<string>(), onToggle: jest.fn(), onLasso: jest.fn() });

    it('toggles the pole under a tap (within the touch reach) and reads it', () => {
      const onPick = jest.fn();
      const c = choosing();
      renderWithProviders(<Stereonet scene={scene} selectedId={null} onPick={onPick} choosing={c} />);
      const svg = screen.getByRole('img', { name: /2 poles/ });
      const a = scene.poles[0];
      const at = { clientX: a.x + PICK_REACH_PX - 2, clientY: a.y, pointerId: 1, pointerType: 'touch' };
      fireEvent.pointerDown(svg, at);
      expect(c.onToggle).not.toHaveBeenCalled(); // on the lift, not the press
      fireEvent.pointerUp(svg, at);
      expect(c.onToggle).toHaveBeenCalledWith('a');
      expect(onPick).toHaveBeenLastCalledWith(expect.objectContaining({ id: 'a' }));
      // A tap on no pole chooses nothing.
      const away = { ...at, clientX: a.x + PICK_REACH_PX + 3 };
      fireEvent.pointerDown(svg, away);
      fireEvent.pointerUp(svg, away);
      expect(c.onToggle).toHaveBeenCalledTimes(1);
      expect(c.onLasso).not.toHaveBeenCalled();
    });

    it('draws a lasso on a drag and hands over the poles inside it', () => {
      const c = choosing();
      renderWithProviders(<Stereonet scene={scene} selectedId={null} onPick={jest.fn()} choosing={c} />);
      const svg = screen.getByRole('img', { name: /2 poles/ });
      const a = scene.poles[0];
      // A square loop 30 px either side of pole a, drawn with a pen in 10 px steps.
      const loop: Array<[number, number]> = [];
      for (let t = -30; t <= 30; t += 10) loop.push([a.x + t, a.y - 30]);
      for (let t = -20; t <= 30; t += 10) loop.push([a.x + 30, a.y + t]);
      for (let t = 20; t >= -30; t -= 10) loop.push([a.x + t, a.y + 30]);
      for (let t = 20; t >= -20; t -= 10) loop.push([a.x - 30, a.y + t]);
      const ev = ([x, y]: [number, number]) => ({ clientX: x, clientY: y, pointerId: 7, pointerType: 'pen' });
      fireEvent.pointerDown(svg, ev(loop[0]));
      for (const p of loop.slice(1)) fireEvent.pointerMove(svg, ev(p));
      expect(svg.querySelector('[data-role="lasso"]')).not.toBeNull();
      fireEvent.pointerUp(svg, ev(loop[loop.length - 1]));
      expect(svg.querySelector('[data-role="lasso"]')).toBeNull();
      expect(c.onLasso).toHaveBeenCalledWith(['a']);
      expect(c.onToggle).not.toHaveBeenCalled();
      // A wobble shorter than the lasso's start is still a tap.
      expect(LASSO_START_PX).toBeLessThan(PICK_REACH_PX);
      fireEvent.pointerDown(svg, ev([a.x, a.y]));
      fireEvent.pointerMove(svg, ev([a.x + 5, a.y + 4]));
      fireEvent.pointerUp(svg, ev([a.x + 5, a.y + 4]));
      expect(c.onToggle).toHaveBeenCalledWith('a');
    });

    it('toggles the pole being read with Space or Enter, and marks the chosen poles', () => {
      const c = { ...choosing(), ids: new Set(['b']) };
      renderWithProviders(<Stereonet scene={scene} selectedId="a" onPick={jest.fn()} choosing={c} />);
      const svg = screen.getByRole('img', { name: /2 poles/ });
      fireEvent.keyDown(svg, { key: ' ' });
      expect(c.onToggle).toHaveBeenLastCalledWith('a');
      fireEvent.keyDown(svg, { key: 'Enter' });
      expect(c.onToggle).toHaveBeenCalledTimes(2);
      const marks = svg.querySelectorAll('[data-role="chosen-pole"]');
      expect([...marks].map((m) => m.getAttribute('data-id'))).toEqual(['b']);
      expect(marks[0].getAttribute('cx')).toBe(String(scene.poles[1].x));
    });

    it('without choosing, Space does nothing and no pole is marked chosen', () => {
      const onPick = jest.fn();
      renderWithProviders(<Stereonet scene={scene} selectedId="a" onPick={onPick} />);
      const svg = screen.getByRole('img', { name: /2 poles/ });
      fireEvent.keyDown(svg, { key: ' ' });
      expect(onPick).not.toHaveBeenCalled();
      expect(svg.querySelector('[data-role="chosen-pole"]')).toBeNull();
      expect(svg.getAttribute('data-choosing')).toBeNull();
    });
  });
});
