export function ProgressBar({ value, label, tone }: { value: number; label: string; tone: "accent" | "pass" }) {
  const percent = Math.round(Math.max(0, Math.min(1, value)) * 100);
  return (
    <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} className="mt-2 h-2 w-full overflow-hidden rounded bg-slate-line">
      <div className={`h-full ${tone === "accent" ? "bg-accent" : "bg-bin-pass"} transition-[width]`} style={{ width: `${percent}%` }} />
    </div>
  );
}
