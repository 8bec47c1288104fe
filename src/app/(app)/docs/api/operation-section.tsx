import type { OperationView } from "@/server/openapi/docs-model";
import { DocText, FieldTable, TypeText } from "./field-table";

const METHOD_STYLE: Record<string, string> = {
  GET: "bg-accent text-white",
  POST: "bg-ink text-white",
  PATCH: "bg-caution text-white",
  PUT: "bg-caution text-white",
  DELETE: "bg-alert text-white",
};

function MethodBadge({ method }: { method: string }) {
  return <span className={`inline-block w-16 rounded px-2 py-0.5 text-center text-xs font-semibold tracking-wide ${METHOD_STYLE[method] ?? "bg-ink-muted text-white"}`}>{method}</span>;
}

function Subheading({ children }: { children: string }) {
  return <h4 className="mb-2 mt-5 text-xs font-semibold uppercase tracking-[0.14em] text-ink-muted">{children}</h4>;
}

export function OperationSection({ operation }: { operation: OperationView }) {
  const { body } = operation;
  return (
    <section id={operation.anchor} className="scroll-mt-6 rounded-lg border border-slate-line bg-slate-panel p-5">
      <header className="flex flex-wrap items-center gap-3">
        <MethodBadge method={operation.method} />
        <code className="text-sm font-semibold text-ink">{operation.path}</code>
        <span className="text-sm text-ink-soft">{operation.summary}</span>
      </header>
      {operation.description ? (
        <p className="mt-3 max-w-4xl text-sm text-ink-soft">
          <DocText text={operation.description} />
        </p>
      ) : null}
      <p className="mt-2 text-xs text-ink-muted">
        {operation.roles ? `Roles: ${operation.roles.join(", ")}` : "No sign-in needed"}
      </p>

      {operation.parameters.length > 0 ? (
        <>
          <Subheading>Parameters</Subheading>
          <FieldTable rows={operation.parameters} withLocation />
        </>
      ) : null}

      {body ? (
        <>
          <Subheading>Request body</Subheading>
          <p className="mb-2 text-sm text-ink-soft">
            {body.contentTypes.map((type) => (
              <code key={type} className="mr-2 rounded bg-slate-wash px-1 text-xs">
                {type}
              </code>
            ))}
            <TypeText parts={body.type} /> {body.description ? <DocText text={body.description} /> : null}
          </p>
          {body.fields.length > 0 ? <FieldTable rows={body.fields} /> : null}
          {body.variants.map((rows, i) => (
            <div key={i} className="mt-3">
              <p className="mb-1 text-xs font-medium text-ink-muted">{i === 0 ? "One of:" : "or:"}</p>
              <FieldTable rows={rows} />
            </div>
          ))}
        </>
      ) : null}

      <Subheading>Responses</Subheading>
      <table className="w-full text-left text-sm">
        <tbody className="divide-y divide-slate-line">
          {operation.responses.map((response) => (
            <tr key={response.status} className="align-top">
              <td className="tabular w-16 py-2 pr-4 font-semibold text-ink">{response.status}</td>
              <td className="py-2 pr-4 text-ink-soft">
                <DocText text={response.description} />
              </td>
              <td className="py-2 text-right">
                {response.type.length > 0 ? <TypeText parts={response.type} /> : null}
                {response.contentTypes.length > 0 ? <span className="ml-2 text-xs text-ink-muted">{response.contentTypes.join(", ")}</span> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>

      <Subheading>Example</Subheading>
      <pre className="overflow-x-auto rounded bg-slate-rail p-3 text-xs leading-relaxed text-slate-wash">
        <code>{operation.curl}</code>
      </pre>
    </section>
  );
}
