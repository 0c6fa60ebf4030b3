// Review for supervisors: filter the log, page through it, totals, chain status per device, the
// vessel report with its trend chart, export and import. Reads the store a page at a time.
import { useEffect, useRef, useState } from 'preact/hooks';
import type { CheckRecord, VesselRecord } from '../../store/index.ts';
import '../desk/wide-layout.css';
import './review.css';
import { ReviewFilters } from './ReviewFilters.tsx';
import { ReviewList } from './ReviewList.tsx';
import { ReviewTotals } from './ReviewTotals.tsx';
import { ChainPanel } from './ChainPanel.tsx';
import { TransferPanel } from './TransferPanel.tsx';
import { VesselReport } from './VesselReport.tsx';
import { KindRecords } from './KindRecords.tsx';
import { EMPTY_FORM, NO_FILTER, readFilterForm, type FilterForm, type ReviewFilter } from './review-filter.ts';
import { TablePager, reviewVessels, storeFilter } from './review-query.ts';
import { countTotals, type ReviewTotals as Totals } from './review-totals.ts';
import { rowView, sortOfOrder, type RowOrder, type RowView } from './row-view.ts';
import { OUTCOMES, VERDICTS } from './record-facts.ts';
import { refreshVessels } from '../state/app-state.ts';
import { useWide } from '../state/wide.ts';
import { WideReview } from './WideReview.tsx';

const VERDICT_IDS = VERDICTS.map((v) => v.id);

function afterPaint(): Promise<void> {
  return new Promise((done) => requestAnimationFrame(() => setTimeout(done, 0)));
}

/** `param`: a vessel id to open the Review on that vessel's history (the plant overview's rows link here). */
export function ReviewScreen({ param }: { param?: string | undefined }) {
  const [vessels, setVessels] = useState<VesselRecord[]>([]);
  const [form, setForm] = useState<FilterForm>(() => (param ? { ...EMPTY_FORM, vesselId: param } : EMPTY_FORM));
  const [filter, setFilter] = useState<ReviewFilter>(() => (param ? { ...NO_FILTER, vesselId: param } : NO_FILTER));
  const [formError, setFormError] = useState<{ field: keyof FilterForm; message: string } | null>(null);
  const [rows, setRows] = useState<RowView[]>([]);
  const [more, setMore] = useState(false);
  const [loading, setLoading] = useState(true);
  const [order, setOrder] = useState<RowOrder>('newest');
  const [totals, setTotals] = useState<{ value: Totals | null; complete: boolean }>({ value: null, complete: false });
  const [readError, setReadError] = useState('');
  const [generation, setGeneration] = useState(0);
  // Counts first pages shown: lets a test or benchmark see that the rows now belong to the new filter.
  const [shown, setShown] = useState(0);
  const [reportFor, setReportFor] = useState<string | null>(null);
  // While an import writes, counting totals would only compete with it for the store.
  const [importing, setImporting] = useState(false);
  const pager = useRef<TablePager | null>(null);
  const [openRecord, setOpenRecord] = useState<CheckRecord | null>(null);
  // Every order is the store's over the whole match: time pages straight from the month buckets,
  // the others sort the match's month rows once (sortChecks) and page through that.
  const [shownOrder, setShownOrder] = useState<RowOrder>(order);

  useEffect(() => {
    const stop = new AbortController();
    const p = new TablePager(filter, sortOfOrder(order), 50);
    pager.current = p;
    setLoading(true);
    setReadError('');
    setTotals({ value: null, complete: false });
    void (async () => {
      try {
        const first = await p.nextPage(stop.signal);
        if (stop.signal.aborted) return;
        // Read from the store, not yet drawn: the benchmark tells store time from render time by it.
        performance.mark('tankside: first page read');
        setRows(first.rows.map(rowView));
        setMore(first.more);
        setShownOrder(order);
        setLoading(false);
        setShown((n) => n + 1);
        // Totals walk the whole match once the first rows are painted, so they never delay them.
        await afterPaint();
        if (stop.signal.aborted || importing) return;
        const done = await countTotals(filter, { signal: stop.signal, onProgress: (t) => setTotals({ value: t, complete: false }) });
        if (done) setTotals({ value: done, complete: true });
      } catch (e) {
        if (!stop.signal.aborted) {
          setReadError(e instanceof Error ? e.message : String(e));
          setLoading(false);
        }
      }
    })();
    return () => stop.abort();
  }, [filter, generation, importing, order]);

  // Issued after the first page's read, so the picker's vessels never hold up the first rows.
  useEffect(() => { void reviewVessels().then(setVessels, () => setVessels([])); }, [generation]);

  const changeForm = (next: FilterForm) => {
    setForm(next);
    const reading = readFilterForm(next, VERDICT_IDS, OUTCOMES);
    if (reading.ok) {
      setFormError(null);
      setFilter(reading.filter);
    } else {
      setFormError({ field: reading.field, message: reading.message });
    }
  };
  const showMore = async () => {
    const p = pager.current;
    if (!p) return;
    setLoading(true);
    try {
      const page = await p.nextPage();
      if (pager.current !== p) return;
      setRows((r) => [...r, ...page.rows.map(rowView)]);
      setMore(page.more);
    } catch (e) {
      setReadError(e instanceof Error ? e.message : String(e));
    } finally {
      setLoading(false);
    }
  };
  const vessel = filter.vesselId ? vessels.find((v) => v.id === filter.vesselId) : undefined;
  const wide = useWide();
  const filters = <ReviewFilters form={form} vessels={vessels} error={formError} onChange={changeForm} />;
  const failure = readError ? <p class="panel field-error" role="alert">The log could not be read: {readError}</p> : null;
  const totalsPanel = <ReviewTotals totals={totals.value} complete={totals.complete} paused={importing} />;

  return (
    <div class="review-screen" data-shown={shown}>
      {wide ? (
        <div class="no-print">
          <WideReview side={<>{filters}{failure}{totalsPanel}</>} filter={filter} generation={generation} open={openRecord} onOpen={setOpenRecord} />
        <KindRecords key={generation} vesselId={filter.vesselId ?? null} fromMs={filter.fromMs} toMs={filter.toMs} idPrefix="rk" title="Cycles and periodic tests" />
        </div>
      ) : (
        <div class="no-print">
          {filters}
          {failure}
          {totalsPanel}
          <ReviewList rows={rows} order={order} shownOrder={shownOrder} loading={loading} more={more} onOrder={setOrder} onMore={() => void showMore()} />
          <KindRecords key={generation} vesselId={filter.vesselId ?? null} fromMs={filter.fromMs} toMs={filter.toMs} idPrefix="rk" title="Cycles and periodic tests" />
        </div>
      )}
      {vessel && reportFor === vessel.id ? (
        <VesselReport vessel={vessel} fromMs={filter.fromMs} toMs={filter.toMs} from={form.from} to={form.to} />
      ) : vessel ? (
        <p class="panel no-print">
          <button type="button" class="primary" onClick={() => setReportFor(vessel.id)}>Trend and report for {vessel.tag}</button>
        </p>
      ) : (
        <p class="panel muted no-print">Pick a vessel in the filter for its trend chart and printable report.</p>
      )}
      <div class="no-print">
        <ChainPanel />
        <TransferPanel filter={storeFilter(filter)} onBusy={setImporting} onImported={() => {
          setGeneration((g) => g + 1);
          // The field screens' vessel list too: an import may have brought vessels.
          void refreshVessels().catch(() => undefined);
        }} />
      </div>
    </div>
  );
}
