import { type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, useId } from "react";

const control =
  "mt-1 block w-full rounded border border-slate-line bg-white px-3 py-2 text-sm text-ink focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30 aria-[invalid=true]:border-alert";

interface FieldProps {
  label: string;
  name: string;
  errors?: string[] | undefined;
  hint?: ReactNode;
  unit?: string;
}

function Messages({ id, errors, hint }: { id: string } & Pick<FieldProps, "errors" | "hint">) {
  return (
    <>
      {hint && !errors?.length ? <span className="mt-1 block text-xs text-ink-muted">{hint}</span> : null}
      {errors?.length ? (
        <span id={`${id}-error`} role="alert" className="mt-1 block text-xs text-alert">
          {errors.join(" ")}
        </span>
      ) : null}
    </>
  );
}

export function TextField({ label, name, errors, hint, unit, ...props }: FieldProps & InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  return (
    <div className="text-sm font-medium text-ink-soft">
      <label htmlFor={id}>
        {label}
        {unit ? <span className="ml-1 font-normal text-ink-muted">({unit})</span> : null}
      </label>
      <input id={id} name={name} aria-invalid={Boolean(errors?.length)} aria-describedby={errors?.length ? `${id}-error` : undefined} className={control} {...props} />
      <Messages id={id} errors={errors} hint={hint} />
    </div>
  );
}

export function SelectField({ label, name, errors, hint, children, ...props }: FieldProps & SelectHTMLAttributes<HTMLSelectElement>) {
  const id = useId();
  return (
    <div className="text-sm font-medium text-ink-soft">
      <label htmlFor={id}>{label}</label>
      <select id={id} name={name} aria-invalid={Boolean(errors?.length)} aria-describedby={errors?.length ? `${id}-error` : undefined} className={control} {...props}>
        {children}
      </select>
      <Messages id={id} errors={errors} hint={hint} />
    </div>
  );
}

export function FormMessage({ result }: { result: { ok: boolean; message?: string } | null }) {
  if (!result || result.ok || !result.message) return null;
  return (
    <p role="alert" className="rounded border border-alert/30 bg-alert-wash px-3 py-2 text-sm text-alert">
      {result.message}
    </p>
  );
}
