"use client";

import { useMemo, useState, useTransition } from "react";
import { ChartFrame } from "@/components/charts/chart-frame";
import { energyWindowOption, expectedCurveOption } from "@/components/charts/device-model-options";
import { Button } from "@/components/ui/button";
import { curves, DeviceModelError } from "@/domain/device-model";
import { CONDUCTANCE_QUANTUM_S } from "@/domain/transport/constants";
import { DeviceModelTableError, parseConductanceTable, suggestedWindowV } from "@/domain/transport";
import { type ConductanceUnit, formatConductance } from "@/lib/format";
import type { DeviceModelInput } from "@/lib/schemas/products";
import { saveDeviceModelAction, setSpecFromModelAction } from "./actions";

interface Props {
  code: string;
  model: DeviceModelInput | null;
  windowFactor: number;
  unit: ConductanceUnit;
  editable: boolean;
  recentLots: { temperatureK: number; medianS: number }[];
}

const input = "mt-1 block w-full rounded border border-slate-line bg-white px-2 py-1.5 text-sm";

/**
 * The product's conductance-function model (§8): G(E) and the thermal window F_T on one energy axis, the expected
 * linear-response G against temperature and Fermi level, the suggested bias window, and the measured lot medians
 * beside it. Energies are relative to the Fermi level at the probe (μ = 0 eV unless moved here).
 */
export function DeviceModelPanel({ code, model: saved, windowFactor, unit, editable, recentLots }: Props) {
  const [model, setModel] = useState<DeviceModelInput>(saved ?? { kind: "step", modes: 1, transmission: 1, edgeEv: -0.1 });
  const [mu, setMu] = useState(0);
  const [temperatureK, setTemperatureK] = useState(300.15);
  const [tolerance, setTolerance] = useState(10);
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const computed = useMemo(() => {
    try {
      return { data: curves(model, mu, temperatureK), error: null };
    } catch (error) {
      return { data: null, error: error instanceof DeviceModelError || error instanceof RangeError ? error.message : String(error) };
    }
  }, [model, mu, temperatureK]);
  const c = computed.data;
  const windowMv = suggestedWindowV(temperatureK, windowFactor) * 1e3;
  const medianOfMeasured = recentLots.length ? [...recentLots].sort((a, b) => a.medianS - b.medianS)[Math.floor(recentLots.length / 2)]!.medianS : null;

  function loadTable(file: File) {
    file.text().then((text) => {
      try {
        setModel({ kind: "table", points: parseConductanceTable(text).points });
        setMessage(`Loaded ${file.name}.`);
      } catch (error) {
        setMessage(error instanceof DeviceModelTableError ? `${file.name}: line ${error.line}: ${error.message}` : String(error));
      }
    });
  }

  return (
    <div className="space-y-5">
      <div className="grid gap-4 md:grid-cols-6">
        <label className="text-sm text-ink-soft">Model
          <select className={input} value={model.kind} disabled={!editable} onChange={(e) => setModel(e.target.value === "step" ? { kind: "step", modes: 1, transmission: 1, edgeEv: -0.1 } : { kind: "table", points: [[-0.2, 0], [0.2, CONDUCTANCE_QUANTUM_S]] })}>
            <option value="step">M modes above a band edge</option>
            <option value="table">Table of G(E) (CSV)</option>
          </select>
        </label>
        {model.kind === "step" ? (
          <>
            <label className="text-sm text-ink-soft">Modes M<input className={input} type="number" min={1} step={1} value={model.modes} disabled={!editable} onChange={(e) => setModel({ ...model, modes: Math.max(1, Math.round(Number(e.target.value) || 1)) })} /></label>
            <label className="text-sm text-ink-soft">Transmission 𝒯<input className={input} type="number" min={0} max={1} step={0.01} value={model.transmission} disabled={!editable} onChange={(e) => setModel({ ...model, transmission: Number(e.target.value) })} /></label>
            <label className="text-sm text-ink-soft">Band edge E_c − μ (meV)<input className={input} type="number" step={1} value={Number((model.edgeEv * 1e3).toFixed(3))} disabled={!editable} onChange={(e) => setModel({ ...model, edgeEv: Number(e.target.value) / 1e3 })} /></label>
          </>
        ) : (
          <label className="text-sm text-ink-soft md:col-span-3">G(E) table: energy_ev,conductance_s<input className={input} type="file" accept=".csv,text/csv" disabled={!editable} onChange={(e) => e.target.files?.[0] && loadTable(e.target.files[0])} /><span className="text-xs text-ink-muted">{model.points.length} points, {model.points[0]![0]} to {model.points.at(-1)![0]} eV</span></label>
        )}
        <label className="text-sm text-ink-soft">Fermi level shift μ (meV)<input className={input} type="number" step={1} value={mu * 1e3} onChange={(e) => setMu(Number(e.target.value) / 1e3)} /></label>
        <label className="text-sm text-ink-soft">Temperature T (K)<input className={input} type="number" min={1} step={1} value={temperatureK} onChange={(e) => setTemperatureK(Number(e.target.value))} /></label>
      </div>
      {computed.error ? <p role="alert" className="text-sm text-alert">{computed.error}</p> : null}
      {message ? <p role="status" className="text-sm text-ink-soft">{message}</p> : null}
      {c ? (
        <>
          <div className="grid gap-3 md:grid-cols-4">
            {[
              ["Expected G", `${formatConductance(c.expected.conductanceS, unit)} (${c.expected.modes.toPrecision(4)} G₀)`],
              ["Suggested bias window", `±${windowMv.toFixed(2)} mV (w = ${windowFactor} · kT/q)`],
              ["Measured median, recent lots", medianOfMeasured === null ? "no lots yet" : formatConductance(medianOfMeasured, unit)],
              ["Model vs measured", medianOfMeasured === null ? "—" : `${(((medianOfMeasured - c.expected.conductanceS) / c.expected.conductanceS) * 100).toFixed(1)} %`],
            ].map(([k, v]) => (
              <div key={k} className="rounded border border-slate-line px-3 py-2"><p className="text-xs uppercase tracking-wide text-ink-muted">{k}</p><p className="tabular mt-0.5 text-sm font-medium">{v}</p></div>
            ))}
          </div>
          {c.expected.warnings.map((w) => <p key={w} className="text-sm text-caution">{w}</p>)}
          <ChartFrame ariaLabel="Conductance function and thermal broadening on one energy axis" option={energyWindowOption(c)} height={300} />
          <div className="grid gap-4 lg:grid-cols-2">
            <ChartFrame ariaLabel="Expected conductance against temperature" height={260} option={expectedCurveOption(c.temperature.map((p) => [p.temperatureK, p.modes]), "T (K)", { x: temperatureK, label: `${temperatureK} K` }, recentLots.map((l) => [l.temperatureK, l.medianS / CONDUCTANCE_QUANTUM_S]))} />
            <ChartFrame ariaLabel="Expected conductance against Fermi level" height={260} option={expectedCurveOption(c.fermiLevel.map((p) => [p.fermiLevelEv * 1e3, p.modes]), "μ (meV)", { x: mu * 1e3, label: "μ" })} />
          </div>
        </>
      ) : null}
      {editable ? (
        <div className="flex flex-wrap items-end gap-3 border-t border-slate-line pt-4">
          <Button disabled={pending || !c} onClick={() => start(async () => { const r = await saveDeviceModelAction({ code, model: JSON.stringify(model) }); setMessage(r.ok ? "Device model saved." : r.message); })}>Save model</Button>
          <label className="text-sm text-ink-soft">Spec window ± (%)<input className={`${input} w-24`} type="number" min={1} max={50} value={tolerance} onChange={(e) => setTolerance(Number(e.target.value))} /></label>
          <Button variant="secondary" disabled={pending || !c} onClick={() => start(async () => { const r = await setSpecFromModelAction({ code, targetS: String(c!.expected.conductanceS), tolerancePercent: String(tolerance) }); setMessage(r.ok ? `Spec window set to ${formatConductance(r.data.specLowS, unit)} – ${formatConductance(r.data.specHighS, unit)} around the expected G at ${temperatureK} K.` : r.message); })}>Use expected G as the spec target</Button>
          <p className="w-full text-xs text-ink-muted">Setting a spec window follows the fab&apos;s procedures and the customer&apos;s agreement; the model suggests a target, it does not replace qualification data.</p>
        </div>
      ) : null}
    </div>
  );
}
