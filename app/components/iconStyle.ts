/**
 * How each icon of an icon array is drawn: one person figure, one palette, shared by the
 * arrays and their legend so a legend swatch always looks exactly like the icon it explains.
 *
 * Palette (our own; contrast measured against the white page, WCAG 2.2 SC 1.4.11 needs ≥ 3:1):
 * - reference events: dark blue #1f4e8a, solid (8.35:1)
 * - added events: orange #c05a00 with white diagonal stripes, outlined #8a3c00 (7.70:1)
 * - avoided events: white with orange diagonal stripes, outlined #8a3c00 (7.70:1)
 * - no event: pale grey #e8ebef, outlined mid grey #6b7280 (4.83:1)
 * - "could be" (inside the interval): a dashed dark-orange outline #8a3c00 (7.70:1); an icon
 *   that has no event at the estimate is also tinted light orange #f5d2b3.
 * Blue against orange avoids the red/green pair; the two event colours also differ in
 * lightness (1.87:1), and the stripes and the dashed outline are a second cue that survives
 * greyscale print (WCAG 2.2 SC 1.4.1).
 */
import type { IconKind } from '@/lib/engine/iconArray';

export const ICON_COLOURS = {
  event: '#1f4e8a',
  added: '#c05a00',
  edge: '#8a3c00',
  none: '#e8ebef',
  noneEdge: '#6b7280',
  couldBe: '#f5d2b3',
  paper: '#ffffff',
} as const;

/** The person figure in a 10 × 12 box: a round head over rounded shoulders. */
export const PERSON_PATH =
  'M7.3 2.5A2.3 2.3 0 1 1 2.7 2.5A2.3 2.3 0 1 1 7.3 2.5Z' +
  'M1.2 12V7.7C1.2 6 2.4 5.3 3.9 5.3H6.1C7.6 5.3 8.8 6 8.8 7.7V12Z';

export const ICON_WIDTH = 10;
export const ICON_HEIGHT = 12;

export interface IconLook {
  readonly fill: string;
  readonly stroke: string;
  readonly strokeWidth: number;
  readonly strokeDasharray?: string;
}

/** Pattern ids are prefixed so two arrays on one page never share an id. */
export function patternIds(idPrefix: string): { added: string; avoided: string } {
  return { added: `${idPrefix}-pattern-added`, avoided: `${idPrefix}-pattern-avoided` };
}

export function iconLook(kind: IconKind, uncertain: boolean, idPrefix: string): IconLook {
  const ids = patternIds(idPrefix);
  const dashed = uncertain ? { strokeDasharray: '1.6 1' } : {};
  switch (kind) {
    case 'event':
      return { fill: ICON_COLOURS.event, stroke: uncertain ? ICON_COLOURS.edge : ICON_COLOURS.event, strokeWidth: uncertain ? 1 : 0.6, ...dashed };
    case 'added':
      return { fill: `url(#${ids.added})`, stroke: ICON_COLOURS.edge, strokeWidth: uncertain ? 1 : 0.6, ...dashed };
    case 'avoided':
      return { fill: `url(#${ids.avoided})`, stroke: ICON_COLOURS.edge, strokeWidth: uncertain ? 1 : 0.6, ...dashed };
    case 'none':
      return uncertain
        ? { fill: ICON_COLOURS.couldBe, stroke: ICON_COLOURS.edge, strokeWidth: 1, ...dashed }
        : { fill: ICON_COLOURS.none, stroke: ICON_COLOURS.noneEdge, strokeWidth: 0.6 };
  }
}
