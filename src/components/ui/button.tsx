import type { ButtonHTMLAttributes } from "react";

const variants = {
  primary: "bg-accent text-white hover:bg-accent-strong disabled:bg-ink-muted",
  secondary: "border border-slate-line bg-slate-panel text-ink hover:bg-slate-wash",
  danger: "border border-alert text-alert hover:bg-alert-wash",
  quiet: "text-accent hover:underline",
} as const;

export function Button({ variant = "primary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: keyof typeof variants }) {
  return (
    <button
      type="button"
      {...props}
      className={`inline-flex items-center justify-center gap-2 rounded px-3 py-1.5 text-sm font-medium focus:outline-none focus-visible:ring-2 focus-visible:ring-accent/50 disabled:cursor-not-allowed ${variants[variant]} ${className}`}
    />
  );
}
