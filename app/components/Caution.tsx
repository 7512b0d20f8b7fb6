/**
 * The not-a-diagnosis caution (lib/wording/caution.ts). It has no close button and no
 * collapsed state, and print styles keep it: it cannot be hidden from a result.
 */
import { CAUTION_HEADING, CAUTION_TEXT } from '@/lib/wording/caution';

export function Caution({ id = 'caution' }: { id?: string }) {
  return (
    <aside className="caution" aria-labelledby={`${id}-heading`} data-testid="caution">
      <h3 id={`${id}-heading`} className="caution__heading">
        {CAUTION_HEADING}
      </h3>
      <p className="caution__text">{CAUTION_TEXT}</p>
    </aside>
  );
}

export default Caution;
