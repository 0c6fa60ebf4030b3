// Shown with every result: the app informs, it does not decide. The wording is the core's.
import { STANDING_NOTE_MESSAGE } from '../../core/basics.ts';

export function StandingNote() {
  return <p class="standing-note"><span class="signal signal-NOTICE">NOTICE</span> {STANDING_NOTE_MESSAGE}</p>;
}
