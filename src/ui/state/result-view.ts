// What a result card shows, already worded and formatted, so components only lay it out.
import type { StoredCaution as Caution } from '../../store/index.ts';
import type { ChartData } from '../components/SaturationChart.tsx';
import type { SketchData } from '../components/VesselSketch.tsx';
import type { Outcome } from './outcome.ts';

export interface Figure { label: string; value: string }

/** One group of the full result: its figures, the notes that belong to it, its picture. */
export interface ResultGroup {
  id: 'saturation' | 'contents' | 'heating' | 'hazards';
  title: string;
  figures: readonly Figure[];
  /** Cautions shown in this group (findings are shown once, above every group, and not again here). */
  notes: readonly Caution[];
  /** Folded until opened (the standing hazards of hot contents). */
  folded: boolean;
}

export interface ResultView {
  /** The vessel is demo data: the card says DEMO DATA above everything else. */
  demo: boolean;
  outcome: Outcome;
  verdict: { tone: 'ok' | 'bad' | 'plan'; text: string; short: string };
  /** The two or three figures that decide the outcome, for the outcome strip. */
  keyFigures: readonly Figure[];
  /** What this reading says about the vessel now, most severe first (shown first, once). */
  findings: readonly Caution[];
  groups: readonly ResultGroup[];
  /** Every figure in one list (older layouts, the fill plan). */
  figures: readonly Figure[];
  hazards: readonly string[];
  /** All cautions, each once, in the person's units. */
  cautions: readonly Caution[];
  chart?: ChartData | undefined;
  sketch?: SketchData | undefined;
}
