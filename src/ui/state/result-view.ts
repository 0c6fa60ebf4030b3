// What the screens show for a computed result: already worded and formatted, so components only lay it out.
import type { StoredCaution as Caution } from '../../store/index.ts';
import type { ChartData } from '../components/SaturationChart.tsx';
import type { SketchData } from '../components/VesselSketch.tsx';

export interface Figure { label: string; value: string }

export interface ResultView {
  /** The vessel is demo data: the card says DEMO DATA above everything else. */
  demo: boolean;
  verdict: { tone: 'ok' | 'bad'; text: string };
  figures: readonly Figure[];
  hazards: readonly string[];
  /** Every caution (the log's list). */
  cautions: readonly Caution[];
  /** What this reading says about the vessel now, shown first; empty when none. */
  findings?: readonly Caution[];
  /** Hazards of hot contents and notes on the method, shown folded below the findings. */
  standing?: readonly Caution[];
  chart?: ChartData | undefined;
  sketch?: SketchData | undefined;
}
