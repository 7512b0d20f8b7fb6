import Link from 'next/link';
import { ConsultationScreen } from './consultation/ConsultationScreen';

/** `/`: the consultation screen. Static: the scenario is read from the address in the browser only. */
export default function Home() {
  return (
    <main id="main">
      <ConsultationScreen />
      <p className="home__checkups-link">
        <Link href="/checkups" prefetch={false}>Workforce checkups: a whole workforce&rsquo;s checkup file</Link>
      </p>
    </main>
  );
}
