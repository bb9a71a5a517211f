import { useState } from 'react';
import { cn } from '@console/utils/cn';
import { distortionSpec, residualSpec, screeningSpec, type ThdForm } from '../utils/distortion-plots';
import { distortionView, residualView, screeningView, type ResultEnvelope } from '../utils/result-view';
import { PlotPanel } from './plot-panel';

function ThdFormSwitch({ value, onChange }: { value: ThdForm; onChange: (form: ThdForm) => void }) {
  return (
    <fieldset className="flex items-center gap-2">
      <legend className="sr-only">THD form</legend>
      <div className="flex rounded-md border border-ink-300 p-0.5">
        {(['thd_f', 'thd_r'] as const).map((form) => (
          <label
            key={form}
            className={cn(
              'cursor-pointer rounded-sm px-2.5 py-1 font-mono text-xs font-semibold has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-signal-700',
              value === form ? 'bg-ink-800 text-white' : 'text-ink-700 hover:bg-ink-100',
            )}
          >
            <input type="radio" name="thd-form" value={form} checked={value === form} onChange={() => onChange(form)} className="sr-only" />
            {form === 'thd_f' ? 'THD_F' : 'THD_R'}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** HD per order and THD (either form), high-order screening and a tone's residual spectrum, when present. */
export function DistortionPlots({ result }: { result: ResultEnvelope }) {
  const view = distortionView(result);
  const screening = screeningView(result);
  const residual = residualView(result);
  const headline = result.conventions.thdHeadline === 'thd_r' ? 'thd_r' : 'thd_f';
  const [form, setForm] = useState<ThdForm>(headline);
  const [shownOrders, setShownOrders] = useState<Set<number>>(() => new Set(view?.orders.slice(0, 3).map((order) => order.order)));

  const toggleOrder = (order: number, shown: boolean) =>
    setShownOrders((current) => {
      const next = new Set(current);
      if (shown) next.add(order);
      else next.delete(order);
      return next;
    });

  return (
    <>
      {view && (
        <PlotPanel
          id="distortion-plot"
          title="Harmonic distortion"
          description={`Plotted at the fundamental frequency. ${form === 'thd_f' ? 'THD_F: harmonics over the fundamental.' : 'THD_R: harmonics over fundamental plus harmonics.'}`}
          controls={<ThdFormSwitch value={form} onChange={setForm} />}
          spec={distortionSpec(view, form, shownOrders)}
          summary={`${form === 'thd_f' ? 'THD_F' : 'THD_R'} and harmonic orders against the fundamental frequency, in percent on a logarithmic axis; upper bounds drawn dashed with hollow markers.`}
          legendExtra={[]}
          heightPx={300}
        />
      )}
      {view && view.orders.length > 0 && (
        <fieldset className="-mt-3 flex flex-wrap items-center gap-3 px-1 text-xs text-ink-700">
          <legend className="sr-only">Harmonic orders shown</legend>
          <span className="font-semibold text-ink-600">Orders shown:</span>
          {view.orders.map((order) => (
            <label key={order.order} className="flex items-center gap-1">
              <input type="checkbox" className="size-3.5 accent-ink-700" checked={shownOrders.has(order.order)} onChange={(event) => toggleOrder(order.order, event.target.checked)} />
              HD{order.order}
            </label>
          ))}
        </fieldset>
      )}
      {screening && (
        <PlotPanel
          title="High-order screening"
          description="RMS sum of the high orders over the fundamental: a rise points at rub, buzz or loose particles."
          spec={screeningSpec(screening)}
          summary="High-order screening energy against the fundamental frequency, in percent."
          heightPx={240}
        />
      )}
      {residual && (
        <PlotPanel title="Residual spectrum" description={residual.description} spec={residualSpec(residual)} summary="Spectrum with the fundamental removed, in dB re the fundamental." heightPx={260} />
      )}
    </>
  );
}
