/**
 * How each icon of an icon array is drawn: one figure, one palette, shared by the arrays and
 * their legend so a legend swatch always looks exactly like the icon it explains.
 *
 * The look is Hundredfold's own (the app's teal and ochre, from its mark in public/icon.svg):
 * - the figure: a round head over a bell-shaped body, narrow at the neck and wide at the base;
 * - reference events ("would have it anyway"): deep teal #0b4d4a, solid (9.66:1 on white);
 * - added events ("extra"): ochre #a3620a sprinkled with white dots, outlined dark ochre #6e4300
 *   (fill 4.87:1, outline 8.52:1);
 * - avoided events: white sprinkled with ochre dots, outlined #6e4300;
 * - no event: pale stone #e9e6df, outlined warm grey #78716a (4.81:1);
 * - the range ("could be", inside the interval): each icon stands on a pale gold tile #f6e2b3,
 *   the tiles of neighbouring icons joining into one band, so the range reads as a block at any
 *   size; the icon also gets a dashed dark-ochre outline (8.52:1), and one with no event at the
 *   estimate is filled cream #fff7e6.
 * Contrast ratios against the white page, WCAG 2.2 SC 1.4.11 (graphics ≥ 3:1), are checked in
 * tests/unit/components/iconStyle.test.ts.
 *
 * Teal against ochre runs along the blue–yellow axis that red–green colour vision keeps, and the
 * two also differ in lightness (about 2:1), so they stay apart in greyscale; the dots, the band
 * and the dashed outline are second cues that survive black-and-white print (WCAG 2.2 SC 1.4.1).
 */
import type { IconKind } from '@/lib/engine/iconArray';

export const ICON_COLOURS = {
  event: '#0b4d4a',
  added: '#a3620a',
  edge: '#6e4300',
  none: '#e9e6df',
  noneEdge: '#78716a',
  couldBe: '#fff7e6',
  zone: '#f6e2b3',
  paper: '#ffffff',
} as const;

/** The figure in a 10 × 12 box: a round head over a bell-shaped body. */
export const PERSON_PATH =
  'M7.05 2.35A2.05 2.05 0 1 1 2.95 2.35A2.05 2.05 0 1 1 7.05 2.35Z' +
  'M1.3 12L1.85 8.3C2.15 6.2 3.35 5.15 5 5.15C6.65 5.15 7.85 6.2 8.15 8.3L8.7 12Z';

export const ICON_WIDTH = 10;
export const ICON_HEIGHT = 12;

export interface IconLook {
  readonly fill: string;
  readonly stroke: string;
  readonly strokeWidth: number;
  readonly strokeDasharray?: string;
  /** The tile the icon stands on when it is inside the range; absent outside it. */
  readonly zone?: string;
}

/** Pattern ids are prefixed so two arrays on one page never share an id. */
export function patternIds(idPrefix: string): { added: string; avoided: string } {
  return { added: `${idPrefix}-pattern-added`, avoided: `${idPrefix}-pattern-avoided` };
}

export function iconLook(kind: IconKind, uncertain: boolean, idPrefix: string): IconLook {
  const ids = patternIds(idPrefix);
  const range = uncertain ? { strokeDasharray: '1.5 0.9', zone: ICON_COLOURS.zone } : {};
  const edgeWidth = uncertain ? 1.1 : 0.6;
  switch (kind) {
    case 'event':
      return { fill: ICON_COLOURS.event, stroke: uncertain ? ICON_COLOURS.edge : ICON_COLOURS.event, strokeWidth: edgeWidth, ...range };
    case 'added':
      return { fill: `url(#${ids.added})`, stroke: ICON_COLOURS.edge, strokeWidth: edgeWidth, ...range };
    case 'avoided':
      return { fill: `url(#${ids.avoided})`, stroke: ICON_COLOURS.edge, strokeWidth: edgeWidth, ...range };
    case 'none':
      return uncertain
        ? { fill: ICON_COLOURS.couldBe, stroke: ICON_COLOURS.edge, strokeWidth: edgeWidth, ...range }
        : { fill: ICON_COLOURS.none, stroke: ICON_COLOURS.noneEdge, strokeWidth: 0.6 };
  }
}
