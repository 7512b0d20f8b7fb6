// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render } from '@testing-library/react';
import { IconArray } from '@/app/components/IconArray';
import { IconLegend } from '@/app/components/IconLegend';
import { ICON_COLOURS } from '@/app/components/iconStyle';
import { exposedLayout } from '@/lib/engine/iconArray';

afterEach(cleanup);

// Counts invented for the test: 8 of 100 at the reference risk, 12 at the estimate, 10 to 15 in the range.
const COUNTS = { denominator: 100, automatic: true, referenceEvents: 8, exposedEvents: 12, exposedLower: 10, exposedUpper: 15 } as const;

describe('IconArray: one figure per person, the range as a band behind its icons', () => {
  it('draws one <use> per person and one range tile per "could be" icon, behind the icons', () => {
    const layout = exposedLayout(COUNTS);
    const { container } = render(<IconArray layout={layout} title="100 people" description="Twelve of them." idPrefix="t" />);
    const uses = container.querySelectorAll('svg use');
    expect(uses).toHaveLength(100);
    // 15 − 10 = 5 icons inside the range (hand-computed from the counts above).
    expect(container.querySelectorAll('svg use[data-uncertain="true"]')).toHaveLength(5);
    const tiles = container.querySelectorAll('.icon-array__range rect');
    expect(tiles).toHaveLength(5);
    for (const tile of tiles) expect(tile.getAttribute('fill')).toBe(ICON_COLOURS.zone);
    // The band is painted first, so every icon sits on top of it.
    const svg = container.querySelector('svg');
    const band = container.querySelector('.icon-array__range');
    expect(svg && band && [...svg.children].indexOf(band) < [...svg.children].indexOf(uses[0] as Element)).toBe(true);
  });

  it('gives the legend\'s "could be" swatch the same tile, and no tile to the others', () => {
    const { container } = render(
      <IconLegend
        idPrefix="k"
        entries={[
          { kind: 'event', label: 'Would have it anyway' },
          { kind: 'added', label: 'Extra' },
          { kind: 'none', uncertain: true, label: 'Could be' },
        ]}
      />,
    );
    const swatches = container.querySelectorAll('.icon-legend__swatch');
    expect(swatches).toHaveLength(3);
    const tileOf = (i: number) => swatches[i]?.querySelector(`rect[fill="${ICON_COLOURS.zone}"]`) ?? null;
    expect(tileOf(0)).toBeNull();
    expect(tileOf(1)).toBeNull();
    expect(tileOf(2)).not.toBeNull();
  });
});
