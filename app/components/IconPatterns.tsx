import { ICON_COLOURS, patternIds } from './iconStyle';

/**
 * The dot patterns an icon array or a legend swatch fills its icons with: added events are ochre
 * sprinkled with white dots, avoided events white sprinkled with ochre dots (iconStyle.ts).
 * The dots sit on a staggered grid, so they read as a texture and not as lines.
 */
export function IconPatterns({ idPrefix }: { idPrefix: string }) {
  const ids = patternIds(idPrefix);
  return (
    <defs>
      <pattern id={ids.added} patternUnits="userSpaceOnUse" width="2.6" height="2.6">
        <rect width="2.6" height="2.6" fill={ICON_COLOURS.added} />
        <circle cx="0.65" cy="0.65" r="0.5" fill={ICON_COLOURS.paper} />
        <circle cx="1.95" cy="1.95" r="0.5" fill={ICON_COLOURS.paper} />
      </pattern>
      <pattern id={ids.avoided} patternUnits="userSpaceOnUse" width="2.6" height="2.6">
        <rect width="2.6" height="2.6" fill={ICON_COLOURS.paper} />
        <circle cx="0.65" cy="0.65" r="0.62" fill={ICON_COLOURS.added} />
        <circle cx="1.95" cy="1.95" r="0.62" fill={ICON_COLOURS.added} />
      </pattern>
    </defs>
  );
}
