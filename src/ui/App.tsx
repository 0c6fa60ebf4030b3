/** Placeholder shell until the field screens land. */
export function App() {
  return (
    <main>
      <h1>Tankside</h1>
      <p>Closed-vessel steam checks, offline.</p>
    </main>
  );
}
