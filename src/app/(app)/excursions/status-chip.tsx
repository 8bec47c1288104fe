import type { ExcursionStatus } from "@/lib/schemas/excursions";

const STYLES: Record<ExcursionStatus, string> = {
  open: "border-alert/40 bg-alert-wash text-alert",
  acknowledged: "border-caution/40 bg-caution-wash text-caution",
  resolved: "border-slate-line bg-slate-wash text-ink-soft",
};

export function StatusChip({ status }: { status: ExcursionStatus }) {
  return <span className={`inline-block rounded border px-2 py-0.5 text-xs font-medium ${STYLES[status]}`}>{status}</span>;
}
