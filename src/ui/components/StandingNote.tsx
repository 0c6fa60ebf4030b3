// Shown with every result: the app informs, it does not decide.
export function StandingNote() {
  return (
    <p class="standing-note">
      These figures support, and never replace, the vessel's inspection regime, local codes and
      licensed practice. If a figure looks wrong, stop and ask the person responsible for the vessel.
    </p>
  );
}
