import { ConsultationScreen } from './consultation/ConsultationScreen';

/** `/`: the consultation screen. Static: the scenario is read from the address in the browser only. */
export default function Home() {
  return (
    <main id="main">
      <ConsultationScreen />
    </main>
  );
}
