// Why each rule carries its signal word: the source, or "common practice" / "from memory" where
// that is all there is (ISO 3864-2 / ANSI Z535.4 meanings at the top of cautions.ts). Kept apart
// from RULE_CATALOGUE so these reasons, which the tests and the docs read, are not shipped in the
// app's JavaScript (the engine's chunk); the type makes every rule, retired ones too, have its reason.
import type { CautionRule, RETIRED_RULES } from './cautions.ts';

export const RULE_REASONS = {
  // Findings: the vessel now.
  'liquid-full-now': 'Liquid-full: further heating raises the pressure by several bar per kelvin until something gives; with heat input this will cause serious injury (hydraulic expansion is a relief case in API Std 521, 6th ed. §4.4.12).',
  'liquid-full-within-band': 'Within the weighing band the contents may be liquid-full: the same hazard as liquid-full-now, but possible rather than certain, so could rather than will (ISO 3864-2 / ANSI Z535.4 meaning).',
  'pressure-above-mawp': 'Above the maximum allowable working pressure the vessel is outside its rating: rupture will cause death or serious injury (ASME BPVC Section VIII Div. 1 defines MAWP as the limit at the top of the vessel).',
  'pressure-at-mawp': 'At MAWP within the gauge band is where a relief valve set at MAWP relieves, and codes allow accumulation above MAWP while it does (ASME BPVC Section VIII Div. 1 UG-125(c): 10 % or 3 psi, from memory): normal relieving, which could injure (hot discharge), not a rupture that will.',
  'pressure-above-relief-set': 'Above the set pressure by more than the gauge band and the valve\'s set-pressure tolerance together, the relief valve should be discharging: hot discharge and a failed valve could cause serious injury (ISO 3864-2 / ANSI Z535.4 WARNING meaning; ±3 % set tolerance is common practice).',
  'pressure-at-relief-set': 'At the set pressure within the combined band the valve may lift or simmer: its steam discharge could cause serious injury (ISO 3864-2 / ANSI Z535.4 WARNING meaning; common practice).',
  'pressure-near-relief-set': 'Running at 90 % of set or more invites simmer and premature lift (an operating margin of about 10 % below set for conventional valves; common practice, API RP 520/521 margin from memory): leaking steam could cause minor or moderate injury.',
  'vacuum-now': 'Below atmosphere now in a vessel not rated for vacuum: buckling could cause serious injury (vessel implosion reports cited in hazards.ts).',
  'liquid-full-on-heating': 'This fill goes liquid-full before the relief set pressure: heating it as planned could cause hydraulic overpressure (API Std 521 §4.4.12).',
  'liquid-full-on-warming': 'Left sealed, this fill goes liquid-full as it warms to its ambient: hydraulic pressure could overpressure the vessel (API Std 521 §4.4.12, thermal expansion of blocked-in liquid).',
  'above-design-temperature': 'Above its design temperature the material\'s allowable stress falls: failure could cause serious injury (ASME BPVC Section VIII Div. 1 design basis; common practice).',
  'noncondensable-gas': 'Gas in the steam space lowers the steam temperature below the gauge\'s saturation temperature: a steriliser load may not be sterilised, and the gas keeps pressure after cooling; either could lead to serious harm (Dalton\'s law, common practice).',
  'pressure-below-saturation': 'Below saturation, an instrument, the atmosphere or the equilibrium is off: figures built on them could mislead into minor or moderate injury (our own reading of the sign, from memory).',
  'superheated-pressure-mismatch': 'The weight says no liquid but the pressure disagrees: the tare, weight or volume is likely wrong, so every figure of the check is in doubt (common practice).',
  'hydraulic-pressure-mismatch': 'The weight says liquid-full but the gauge is outside the hydraulic pressure band: the tare, weight or volume is likely wrong (the liquid-full analogue of superheated-pressure-mismatch; common practice).',
  'site-atmosphere-differs': 'The stored site atmosphere differs from the barometer by more than the weather band: every check converted with it is off (a sea-level value kept for a 1,600 m site gave a false 8.2 % gas warning), which could mislead into minor or moderate injury.',
  // Standing hazards: hot contents whatever the reading.
  'do-not-open-under-pressure': 'Opening a door, cover or fitting while the vessel holds pressure releases it at once: a door or cover thrown open will cause death or serious injury (quick-opening closures, ASME BPVC Section VIII Div. 1 UG-35.2, from memory).',
  'flash-on-release': 'Liquid above its atmospheric boiling point flashes to a scalding jet when released: could cause serious injury (flash fraction by the enthalpy balance of US DOE Steam Tip Sheet #12).',
  'scald': 'Water at 60 °C and above gives a full-thickness burn within seconds, a serious injury (American Burn Association educator\'s guide "Scalds: A Burning Issue"; from memory for the exact times).',
  'hot-surface': 'Jackets, coils and steam-heated walls run at steam temperature: bare metal above about 60-70 °C burns on contact within a second or so, a serious injury (ISO 13732-1 contact-burn thresholds, from memory).',
  'pressure-after-cooling': 'Gas keeps a cooled vessel above atmosphere: a vessel believed cold and empty of steam can still blow a door or fitting open (Dalton\'s law; common practice).',
  'vacuum-on-cooling': 'Sealed and cooled, the steam condenses and the vessel falls below atmosphere; one neither rated for vacuum nor fitted with a vacuum breaker can collapse, which could cause serious injury (implosion reports cited in hazards.ts).',
  'vacuum-on-cooling-protected': 'The same vacuum in a vessel rated for it, or with a vacuum breaker fitted: no injury expected while the rating holds or the breaker works, a practice to keep (ISO 3864-2 / ANSI Z535.4 NOTICE).',
  'quench-vacuum': 'Cold water sprayed or run into a steam-filled vessel condenses the steam faster than a vent or vacuum breaker admits air: sudden vacuum can collapse a vessel not rated for it, which could cause serious injury (common practice).',
  'water-hammer': 'Steam admitted to a flooded or cold line, coil or jacket drives slugs of condensate: the shock can burst pipework or fittings, which could cause serious injury (common practice).',
  'freezing': 'Below 0 °C the water freezes: ice can burst the vessel or its lines and block relief, drain and instrument connections, so a later heat-up could overpressure it, which could cause serious injury (common practice).',
  'boil-over-on-opening': 'Sealed liquids in a steriliser load stay above their boiling point after the chamber pressure falls: opened early, bottles can burst or boil over, which could cause serious injury (fluid-cycle door interlocks hold until about 80 °C for glass; from memory).',
  // Method notes (and the standing note): what the check itself can tell.
  'saturation-check-limits': 'A statement of the method\'s limit (how much gas the band hides), not of the vessel.',
  'atmosphere-assumed': 'A statement of which atmosphere converted the gauge, not of the vessel.',
  'bulk-quality-not-dryness': 'A statement of what the quality figure means (EN 285 steam dryness is a different measure), not of the vessel.',
  'quality-undetermined': 'The tolerances leave the quality anywhere in its range: a statement of the measurement, not of the vessel.',
  'standing-note': 'The app advises; it does not replace the inspection regime, codes, lockout/tagout or licensed practice.',
  // Fill plans: a plan, not the vessel now.
  'plan-exceeds-two-phase-charge': 'A charge above the largest two-phase charge goes liquid-full before the relief set pressure: carried out, it could overpressure the vessel. It describes a plan not yet charged, so WARNING, not DANGER.',
  'plan-does-not-fit': 'The charge is liquid-full at the start temperature: carried out and heated, it could overpressure the vessel (a plan, so WARNING).',
  'plan-target-above-mawp': 'The target\'s saturation pressure is above MAWP: heating to it could overpressure the vessel (a plan, so WARNING).',
  'plan-target-above-relief-set': 'The target\'s saturation pressure is above the relief set pressure: the valve would discharge before the target, which could injure.',
  'plan-above-design-temperature': 'The target is above the design temperature (see above-design-temperature).',
  'plan-assumes-air-removed': 'A statement of the plan\'s assumption, not of the vessel.',
  // Retired rules, classified for stored records.
  'quality-band-reaches-liquid-full': 'Retired: the weighing band reached liquid-full; now liquid-full-within-band.',
  'plan-exceeds-safe-charge': 'Retired: now plan-exceeds-two-phase-charge.',
} as const satisfies Record<CautionRule | keyof typeof RETIRED_RULES, string>;
