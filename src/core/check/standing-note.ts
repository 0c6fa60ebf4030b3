// The standing note's wording on its own, so the start-up screens can show it without the rule
// catalogue (cautions.ts builds the note's Caution from it).

/** The note every result carries (issue 3, item 7; wording ours). Its signal word is NOTICE. */
export const STANDING_NOTE_MESSAGE =
  'Advisory figures only. This app does not replace the vessel\'s inspection regime, local codes ' +
  '(such as ASME BPVC Section VIII, PED 2014/68/EU and national rules), lockout/tagout procedures ' +
  'or licensed practice. Nameplate limits and the competent person\'s instructions take precedence.';
