import type { Metadata } from 'next';
import { CheckupsScreen } from '@/app/components/checkups/CheckupsScreen';

export const metadata: Metadata = { title: 'Workforce checkups — Hundredfold' };

/** `/checkups`: a workforce's checkup file → worklist, summary, exports. The file stays in the browser. */
export default function CheckupsPage() {
  return (
    <main id="main">
      <CheckupsScreen />
    </main>
  );
}
