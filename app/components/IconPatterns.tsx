import { ICON_COLOURS, patternIds } from './iconStyle';

/** The stripe patterns an icon array or a legend swatch fills its icons with. */
export function IconPatterns({ idPrefix }: { idPrefix: string }) {
  const ids = patternIds(idPrefix);
  return (
    <defs>
      <pattern id={ids.added} patternUnits="userSpaceOnUse" width="3" height="3" patternTransform="rotate(45)">
        <rect width="3" height="3" fill={ICON_COLOURS.added} />
        <rect width="0.9" height="3" fill={ICON_COLOURS.paper} />
      </pattern>
      <pattern id={ids.avoided} patternUnits="userSpaceOnUse" width="3" height="3" patternTransform="rotate(-45)">
        <rect width="3" height="3" fill={ICON_COLOURS.paper} />
        <rect width="1.2" height="3" fill={ICON_COLOURS.added} />
      </pattern>
    </defs>
  );
}
