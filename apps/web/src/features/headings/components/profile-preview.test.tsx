import { screen } from '@testing-library/react';
import { ProfilePreview } from '@/features/headings/components/profile-preview';
import { profileOutline } from '@/features/headings/utils/profile-outline';
import { renderWithProviders } from '@/testing/render-with-providers';

describe('ProfilePreview', () => {
  it.each([
    ['circular', 'Circular', 6, 6, /A 3 3 0 1 0 3 3/],
    ['horseshoe', 'Horseshoe', 6.2, 6.4, /Q 3\.1 .* A 3\.1 3\.1 0 0 1 -3\.1 3\.3/],
    ['d-shaped', 'D-shaped', 5, 6, /L 2\.5 3\.5 A 2\.5 2\.5 0 0 1 -2\.5 3\.5 Z/],
    ['rectangular', 'Rectangular', 4, 3, /^M -2 0 L 2 0 L 2 3 L -2 3 Z$/],
  ] as const)(
    'draws a %s profile to scale on a 1 m grid with its size',
    (shape, label, width, height, path) => {
      renderWithProviders(
        <ProfilePreview shape={shape} width={width} height={height} axisHeight={height / 2} />,
      );
      const svg = screen.getByRole('img', {
        name: `${label} profile, ${width} m wide and ${height} m high, to scale on a 1 m grid`,
      });
      expect(svg).toHaveAttribute('data-shape', shape);
      expect(screen.getByTestId('profile-outline').getAttribute('d')).toMatch(path);
      expect(svg).toHaveTextContent(`width ${width} m`);
      expect(svg).toHaveTextContent(`height ${height} m`);
      expect(svg).toHaveTextContent(`axis ${height / 2} m`);
      // Grid lines are 1 m apart: consecutive vertical lines differ by exactly one unit.
      const xs = Array.from(svg.querySelectorAll('[data-grid="vertical"]')).map((l) =>
        Number(l.getAttribute('x1')),
      );
      expect(xs.length).toBeGreaterThanOrEqual(Math.ceil(width));
      xs.slice(1).forEach((x, i) => expect(x - xs[i]).toBe(1));
    },
  );

  it('puts the axis label outside the outline, left of the dashed axis', () => {
    renderWithProviders(<ProfilePreview shape="horseshoe" width={6.2} height={6.4} axisHeight={3.2} />);
    const label = screen.getByTestId('profile-axis-label');
    const axis = screen.getByTestId('profile-axis');
    expect(label).toHaveTextContent('axis 3.2 m');
    // Anchored at its end, which lies left of where the axis line starts (itself outside the 3.1 m half-width).
    expect(label).toHaveAttribute('text-anchor', 'end');
    expect(Number(label.getAttribute('x'))).toBeLessThan(Number(axis.getAttribute('x1')));
    expect(Number(axis.getAttribute('x1'))).toBeLessThan(-3.1);
    // The grid and the drawing reach far enough left to hold the label.
    const svg = screen.getByRole('img');
    const [minX] = (svg.getAttribute('viewBox') ?? '').split(' ').map(Number);
    const fontSize = Number(label.getAttribute('font-size'));
    expect(minX).toBeLessThan(Number(label.getAttribute('x')) - 'axis 3.2 m'.length * fontSize * 0.6);
  });

  it('waits for a usable size before drawing', () => {
    renderWithProviders(<ProfilePreview shape="horseshoe" width={Number.NaN} height={5} />);
    expect(screen.queryByRole('img')).not.toBeInTheDocument();
    expect(screen.getByText(/appears once the shape, width and height are filled in/)).toBeInTheDocument();
  });

  it('keeps the outline inside the width and height it is given', () => {
    const numbers = profileOutline({ shape: 'horseshoe', width: 8, height: 7 })
      .split(/[^-\d.]+/)
      .filter((t) => t !== '')
      .map(Number);
    expect(Math.max(...numbers)).toBeLessThanOrEqual(8);
    expect(Math.min(...numbers)).toBeGreaterThanOrEqual(-4);
  });
});
