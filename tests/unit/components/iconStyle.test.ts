import { describe, expect, it } from 'vitest';
import { ICON_COLOURS, iconLook } from '@/app/components/iconStyle';

/**
 * Contrast ratio (L1 + 0.05) / (L2 + 0.05) from relative luminance
 * L = 0.2126 R + 0.7152 G + 0.0722 B of linearised sRGB channels (WCAG 2.2, definitions of
 * "contrast ratio" and "relative luminance"; the 0.04045 threshold as in IEC 61966-2-1).
 */
function luminance(hex: string): number {
  const channel = (i: number) => {
    const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * channel(0) + 0.7152 * channel(1) + 0.0722 * channel(2);
}

function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

describe('contrast', () => {
  it('gives 21:1 for black on white and 1:1 for a colour on itself (WCAG 2.2 definition)', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrast('#1f4e8a', '#1f4e8a')).toBe(1);
  });
});

describe('icon palette (WCAG 2.2 SC 1.4.11: graphics ≥ 3:1 against the page)', () => {
  it('draws every icon edge in a colour of at least 3:1 on white', () => {
    for (const kind of ['event', 'added', 'avoided', 'none'] as const) {
      for (const uncertain of [false, true]) {
        const look = iconLook(kind, uncertain, 'test');
        expect(contrast(look.stroke, ICON_COLOURS.paper)).toBeGreaterThanOrEqual(3);
      }
    }
  });

  it('fills reference and added events in colours of at least 3:1 on white, told apart by lightness too', () => {
    expect(contrast(ICON_COLOURS.event, ICON_COLOURS.paper)).toBeGreaterThanOrEqual(3);
    expect(contrast(ICON_COLOURS.added, ICON_COLOURS.paper)).toBeGreaterThanOrEqual(3);
    // The palette changed (issue 12, a look of our own): teal #0b4d4a against ochre #a3620a.
    // Hand-computed with the formula above: L(#0b4d4a) ≈ 0.0587, L(#a3620a) ≈ 0.1654, so the
    // ratio is (0.1654 + 0.05) / (0.0587 + 0.05) ≈ 1.98:1.
    expect(contrast(ICON_COLOURS.event, ICON_COLOURS.added)).toBeGreaterThan(1.5);
  });

  it('keeps the three fills apart in greyscale: dark reference events, mid added events, light no-event icons', () => {
    // Lightness steps a greyscale print keeps: each pair at least 1.5:1 apart (common practice for
    // telling fills apart without colour; the outlines and patterns are the second cue).
    expect(contrast(ICON_COLOURS.event, ICON_COLOURS.added)).toBeGreaterThanOrEqual(1.5);
    expect(contrast(ICON_COLOURS.added, ICON_COLOURS.none)).toBeGreaterThanOrEqual(1.5);
    expect(contrast(ICON_COLOURS.added, ICON_COLOURS.zone)).toBeGreaterThanOrEqual(3);
  });

  it('no longer pairs the earlier dark blue with orange (a look of our own)', () => {
    expect(ICON_COLOURS.event).not.toBe('#1f4e8a');
    expect(ICON_COLOURS.added).not.toBe('#c05a00');
    // Teal against ochre: the reference colour is bluish-green (G and B well above R), the added one
    // yellowish-brown (R > G > B), so they sit on the blue–yellow axis red–green colour vision keeps.
    const rgb = (hex: string) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
    const [er, eg, eb] = rgb(ICON_COLOURS.event);
    const [ar, ag, ab] = rgb(ICON_COLOURS.added);
    expect(eg > er && eb > er).toBe(true);
    expect(ar > ag && ag > ab).toBe(true);
  });

  it('marks "could be" icons with a dashed outline and the added and avoided ones with a pattern, not colour alone', () => {
    expect(iconLook('none', true, 'p').strokeDasharray).toBeDefined();
    expect(iconLook('added', true, 'p').strokeDasharray).toBeDefined();
    expect(iconLook('none', false, 'p').strokeDasharray).toBeUndefined();
    expect(iconLook('added', false, 'p').fill).toBe('url(#p-pattern-added)');
    expect(iconLook('avoided', false, 'p').fill).toBe('url(#p-pattern-avoided)');
    expect(iconLook('none', true, 'p').fill).toBe(ICON_COLOURS.couldBe);
  });

  it('stands every icon inside the range on a tile, and no icon outside it', () => {
    for (const kind of ['event', 'added', 'avoided', 'none'] as const) {
      expect(iconLook(kind, true, 'p').zone).toBe(ICON_COLOURS.zone);
      expect(iconLook(kind, false, 'p').zone).toBeUndefined();
      expect(iconLook(kind, true, 'p').strokeDasharray).toBeDefined();
    }
  });
});
