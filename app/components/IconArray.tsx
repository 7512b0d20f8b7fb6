/**
 * One icon array: the whole group as figures (iconStyle.ts), filled row by row from the top-left
 * corner in the order the engine laid out (lib/engine/iconArray.ts). Used on the consultation
 * screen and the handout alike, so every picture in the app is drawn the same way.
 *
 * The picture's text alternative is the sentence printed under it (`description`), so a screen
 * reader hears exactly what a sighted reader reads. Each icon is one `<use>` carrying `data-kind`
 * and `data-uncertain` so tests can count what is drawn; the range's band is drawn behind the
 * icons as plain rectangles.
 */
import { memo } from 'react';
import type { IconArrayLayout } from '@/lib/engine/iconArray';
import { IconPatterns } from './IconPatterns';
import { ICON_COLOURS, ICON_HEIGHT, ICON_WIDTH, iconLook, PERSON_PATH } from './iconStyle';

export interface IconArrayProps {
  readonly layout: IconArrayLayout;
  /** Names the group and the time frame, e.g. "100 women aged 50 to 59, over the next 10 years". */
  readonly title: string;
  /** The visible sentence under the picture; also its text alternative. */
  readonly description: string;
  /** Unique on the page: prefixes the ids of the title, description and patterns. */
  readonly idPrefix: string;
}

/** Space between icons, and the extra gap after every block of 5 columns or 5 rows (drawing units). */
const GAP_X = 2;
const GAP_Y = 3;
const BLOCK = 5;
const BLOCK_GAP = 3;

function position(index: number, columns: number): { x: number; y: number } {
  const column = index % columns;
  const row = Math.floor(index / columns);
  return {
    x: column * (ICON_WIDTH + GAP_X) + Math.floor(column / BLOCK) * BLOCK_GAP,
    y: row * (ICON_HEIGHT + GAP_Y) + Math.floor(row / BLOCK) * BLOCK_GAP,
  };
}

function IconArrayView({ layout, title, description, idPrefix }: IconArrayProps) {
  const { columns, cells } = layout;
  const rows = Math.ceil(cells.length / columns);
  const last = position(columns * rows - 1, columns);
  // Room around the icons for the range's band, which reaches half a gap beyond the outer icons.
  const width = last.x + ICON_WIDTH + GAP_X;
  const height = last.y + ICON_HEIGHT + GAP_Y;
  const symbolId = `${idPrefix}-person`;
  const titleId = `${idPrefix}-title`;
  const descriptionId = `${idPrefix}-description`;
  return (
    <figure className="icon-array" data-denominator={layout.denominator} aria-labelledby={titleId}>
      <figcaption id={titleId} className="icon-array__title">
        {title}
      </figcaption>
      <svg
        className={`icon-array__picture icon-array__picture--${columns}`}
        role="img"
        aria-labelledby={descriptionId}
        viewBox={`${-GAP_X / 2} ${-GAP_Y / 2} ${width} ${height}`}
        preserveAspectRatio="xMidYMin meet"
      >
        <IconPatterns idPrefix={idPrefix} />
        <defs>
          <symbol id={symbolId} viewBox={`0 0 ${ICON_WIDTH} ${ICON_HEIGHT}`} overflow="visible">
            <path d={PERSON_PATH} />
          </symbol>
        </defs>
        {/* The range: a pale tile behind each "could be" icon; neighbouring tiles join into one band. */}
        <g className="icon-array__range" aria-hidden="true">
          {cells.map((cell, index) => {
            if (!cell.uncertain) return null;
            const { x, y } = position(index, columns);
            return <rect key={index} x={x - GAP_X / 2} y={y - GAP_Y / 2} width={ICON_WIDTH + GAP_X} height={ICON_HEIGHT + GAP_Y} fill={ICON_COLOURS.zone} />;
          })}
        </g>
        {cells.map((cell, index) => {
          const { x, y } = position(index, columns);
          const look = iconLook(cell.kind, cell.uncertain, idPrefix);
          return (
            <use
              key={index}
              href={`#${symbolId}`}
              x={x}
              y={y}
              width={ICON_WIDTH}
              height={ICON_HEIGHT}
              fill={look.fill}
              stroke={look.stroke}
              strokeWidth={look.strokeWidth}
              strokeDasharray={look.strokeDasharray}
              data-kind={cell.kind}
              data-uncertain={cell.uncertain ? 'true' : undefined}
            />
          );
        })}
      </svg>
      <p id={descriptionId} className="icon-array__description">
        {description}
      </p>
    </figure>
  );
}

/** Layouts are rebuilt on every keystroke; the picture redraws only when a cell changes. */
function sameProps(a: IconArrayProps, b: IconArrayProps): boolean {
  if (a.title !== b.title || a.description !== b.description || a.idPrefix !== b.idPrefix) return false;
  if (a.layout === b.layout) return true;
  if (a.layout.columns !== b.layout.columns || a.layout.cells.length !== b.layout.cells.length) return false;
  return a.layout.cells.every((cell, i) => {
    const other = b.layout.cells[i];
    return other !== undefined && other.kind === cell.kind && other.uncertain === cell.uncertain;
  });
}

export const IconArray = memo(IconArrayView, sameProps);
export default IconArray;
