import { expectedShift } from "@/domain/device-model";
import { type ConductanceUnit, formatConductance } from "@/lib/format";
import type { DeviceModelInput } from "@/lib/schemas/products";

/** Room temperature of the fab's standard probe recipe (common practice: 27 °C chucks). */
export const REFERENCE_CHUCK_K = 300.15;

/**
 * Says when a lot was probed at another chuck temperature than its reference (the limit set's, else 300.15 K) and,
 * with a device model, how much G the physics alone moves between the two (§8) — so a hot lot is not mistaken for a
 * process shift.
 */
export function TemperatureNote({ lotK, referenceK, model, unit }: { lotK: number; referenceK: number; model: DeviceModelInput | null; unit: ConductanceUnit }) {
  if (Math.abs(lotK - referenceK) < 0.5) return null;
  let shift: ReturnType<typeof expectedShift> | null = null;
  try {
    shift = model ? expectedShift(model, 0, referenceK, lotK) : null;
  } catch {
    shift = null;
  }
  return (
    <div role="note" className="mb-5 rounded border border-caution/40 bg-caution-wash px-4 py-3 text-sm text-ink">
      <p className="font-medium">Probed at {lotK.toFixed(2)} K, not at the reference {referenceK.toFixed(2)} K.</p>
      {shift && shift.relativeChange !== null ? (
        <p className="mt-1 text-ink-soft">
          The product&apos;s device model expects G to move by {(shift.relativeChange * 100).toFixed(2)} % from the temperature alone
          ({formatConductance(shift.from.conductanceS, unit)} at {referenceK.toFixed(2)} K → {formatConductance(shift.to.conductanceS, unit)} at {lotK.toFixed(2)} K).
          Judge this lot&apos;s conductance against limits with that in mind.
        </p>
      ) : (
        <p className="mt-1 text-ink-soft">Without a device model the product gives no expected shift; compare against limits made at the same temperature.</p>
      )}
    </div>
  );
}
