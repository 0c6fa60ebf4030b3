// The report for one vessel and a period: summary, trend chart and every check, laid out so the
// browser's print (save as PDF) gives a clean document; review.css holds its print stylesheet.
import { Fragment } from 'preact';
import { useEffect, useState } from 'preact/hooks';
import type { VesselRecord } from '../../store/index.ts';
import { TrendChart } from './TrendChart.tsx';
import { trendGeometry, trendPoints, TREND_MAX_POINTS, type StandingHazard, type TrendPoint } from './trend-data.ts';
import { periodText, reportRow, reportSummary } from './report-data.ts';
import { outcomeLabel } from './record-facts.ts';
import { KindRecords } from './KindRecords.tsx';
import { ReportInstruments } from './ReportInstruments.tsx';

interface Props {
  vessel: VesselRecord;
  fromMs: number | null;
  toMs: number | null;
  from: string;
  to: string;
}

export function VesselReport({ vessel, fromMs, toMs, from, to }: Props) {
  const [data, setData] = useState<{ points: TrendPoint[]; capped: boolean; standing: StandingHazard[] } | null>(null);
  const [error, setError] = useState('');
  useEffect(() => {
    let live = true;
    setData(null);
    trendPoints(vessel.id, fromMs, toMs).then((d) => live && setData(d), (e: unknown) => live && setError(String(e)));
    return () => { live = false; };
  }, [vessel.id, fromMs, toMs]);
  const period = periodText(from, to);
  if (error) return <p class="field-error" role="alert">The report could not be read: {error}</p>;
  if (!data) return <p class="panel" role="status">Reading the checks of {vessel.tag}…</p>;
  const summary = reportSummary(data.points);
  return (
    <section class="panel print-report" aria-labelledby="report-title">
      <div class="report-head">
        <h2 id="report-title">Vessel report: {vessel.tag}</h2>
        <button type="button" class="primary no-print" onClick={() => window.print()}>Print or save as PDF</button>
      </div>
      <p class="report-description">{vessel.description || 'No description.'}</p>
      <p class="report-period">Period: <strong>{period}</strong></p>
      <dl class="figures review-figures">
        <dt>Checks</dt><dd>{summary.checks}{data.capped ? ` (the newest ${TREND_MAX_POINTS} shown)` : ''}</dd>
        <dt>Gauge agreed with saturation</dt><dd>{summary.consistent}</dd>
        {summary.byOutcome.map((s) => <Fragment key={s.outcome}><dt>Outcome {outcomeLabel(s.outcome)}</dt><dd>{s.count}</dd></Fragment>)}
      </dl>
      {summary.firstTime ? <p>First check {summary.firstTime}; last {summary.lastTime}.</p> : null}
      {data.points.length > 0 ? <TrendChart geometry={trendGeometry(data.points)} title={`Trend of ${vessel.tag}, ${period}`} /> : null}
      <p class="hint">Marks on the chart: checks with findings, coloured by their outcome, the most severe signal word among the findings (DANGER red, WARNING orange, CAUTION yellow, NOTICE blue).</p>
      <div class="table-wrap" tabIndex={0} role="region" aria-label={`Checks of ${vessel.tag}`}>
        <table class="report-table">
          <caption class="visually-hidden">Checks of {vessel.tag}, oldest first</caption>
          <thead>
            <tr><th scope="col">Time</th><th scope="col">Verdict</th><th scope="col">Quality</th><th scope="col">Liquid</th><th scope="col">p − p_sat</th><th scope="col">Outcome</th><th scope="col">By</th></tr>
          </thead>
          <tbody>
            {data.points.map(reportRow).map((r) => (
              <tr key={r.id}>
                <td>{r.time}</td><td>{r.verdict}</td><td>{r.quality}</td><td>{r.liquidMass}</td><td>{r.deviation}</td>
                <td>{r.outcome !== 'none' ? <span class={`signal signal-${r.outcome}`}>{r.outcome}</span> : 'none'}</td><td>{r.technician}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ReportInstruments vessel={vessel} fromMs={fromMs} toMs={toMs} />
      {data.standing.length > 0 ? (
        <section aria-labelledby="report-standing-title">
          <h3 id="report-standing-title">Standing hazards of {vessel.tag}</h3>
          <p class="hint">Listed once: they belong to hot contents whatever each reading said, so they are not counted in the outcomes above. Wording from the latest check that carried each.</p>
          <ul class="cautions" aria-label={`Standing hazards of ${vessel.tag}`}>
            {data.standing.map((h) => (
              <li key={h.rule}><span class="caution-text"><span class={`signal signal-${h.signal}`}>{h.signal}</span>{h.message} ({h.checks} {h.checks === 1 ? 'check' : 'checks'})</span></li>
            ))}
          </ul>
        </section>
      ) : null}
      <KindRecords vesselId={vessel.id} fromMs={fromMs} toMs={toMs} idPrefix="report-kinds" title={`Cycles and periodic tests of ${vessel.tag}`} />
      <p class="standing-note">
        Figures computed with IAPWS-IF97 from the readings as logged. This report does not replace the vessel's
        inspection regime, local codes, lockout/tagout procedures or licensed practice; each check's cautions stay
        with its record.
      </p>
    </section>
  );
}
