export default function Home() {
  return (
    <main>
      <h1>Hundredfold</h1>
      <p>The consultation screen is being built.</p>
    </main>
  );
}
