import type { Page } from '@playwright/test';

/** Page pixels of a point given in mm on the plotting face (the SVG's own units). */
export async function pixelsOf(page: Page, xMm: number, yMm: number): Promise<{ x: number; y: number }> {
  const face = page.getByTestId('plot-face');
  await face.scrollIntoViewIfNeeded();
  return face.evaluate(
    (svg, [x, y]) => {
      const p = new DOMPoint(x, y).matrixTransform((svg as SVGSVGElement).getScreenCTM()!);
      return { x: p.x, y: p.y };
    },
    [xMm, yMm] as const,
  );
}
