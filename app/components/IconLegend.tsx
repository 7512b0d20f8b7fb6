/**
 * The key to an icon array: one swatch per kind of icon, drawn with the same figure and look
 * as the array itself, beside its label. The labels come from lib/wording
 * ({@link legendEntriesFrom} turns an array's `LegendItem`s into entries).
 */
import type { IconKind } from '@/lib/engine/iconArray';
import type { LegendItem } from '@/lib/wording/patient';
import { IconPatterns } from './IconPatterns';
import { ICON_HEIGHT, ICON_WIDTH, iconLook, PERSON_PATH } from './iconStyle';

export interface IconLegendEntry {
  readonly kind: IconKind;
  /** True for the "could be" swatch: an icon inside the interval's range. */
  readonly uncertain?: boolean;
  readonly label: string;
}

export interface IconLegendProps {
  readonly entries: readonly IconLegendEntry[];
  /** Unique on the page: prefixes the swatches' pattern ids. */
  readonly idPrefix: string;
  /** Heading of the key, e.g. "Key to the pictures". */
  readonly heading?: string;
}

/**
 * lib/wording's legend items as entries, labelled with their counts ("Will not have it (92
 * people)"); "could be" becomes an uncertain icon with no event at the estimate.
 */
export function legendEntriesFrom(items: readonly LegendItem[]): IconLegendEntry[] {
  return items.map((item) => (item.kind === 'uncertain' ? { kind: 'none', uncertain: true, label: item.text } : { kind: item.kind, label: item.text }));
}

export function IconLegend({ entries, idPrefix, heading = 'Key to the pictures' }: IconLegendProps) {
  return (
    <div className="icon-legend">
      <p className="icon-legend__heading">{heading}</p>
      <ul className="icon-legend__list">
        {entries.map((entry, i) => {
          const swatchPrefix = `${idPrefix}-swatch-${i}`;
          const look = iconLook(entry.kind, entry.uncertain === true, swatchPrefix);
          return (
            <li key={`${entry.kind}-${entry.uncertain === true}`} className="icon-legend__item">
              <svg className="icon-legend__swatch" viewBox={`-1 -1 ${ICON_WIDTH + 2} ${ICON_HEIGHT + 2}`} aria-hidden="true" focusable="false">
                <IconPatterns idPrefix={swatchPrefix} />
                {look.zone ? <rect x={-1} y={-1} width={ICON_WIDTH + 2} height={ICON_HEIGHT + 2} fill={look.zone} /> : null}
                <path d={PERSON_PATH} fill={look.fill} stroke={look.stroke} strokeWidth={look.strokeWidth} strokeDasharray={look.strokeDasharray} />
              </svg>
              <span>{entry.label}</span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}

export default IconLegend;
