import type { FieldRow, TypePart } from "@/server/openapi/schema-text";

/** Text with `backtick` spans shown as code, as the document's descriptions write them. */
export function DocText({ text }: { text: string }) {
  return (
    <>
      {text.split("`").map((part, i) =>
        i % 2 === 1 ? (
          <code key={i} className="rounded bg-slate-wash px-1 text-[0.85em]">
            {part}
          </code>
        ) : (
          part
        ),
      )}
    </>
  );
}

export function TypeText({ parts }: { parts: TypePart[] }) {
  return (
    <code className="text-xs text-ink-soft">
      {parts.map((part, i) =>
        part.ref ? (
          <a key={i} href={`#schema-${part.ref}`} className="text-accent hover:underline">
            {part.text}
          </a>
        ) : (
          <span key={i}>{part.text}</span>
        ),
      )}
    </code>
  );
}

export function FieldTable({ rows, withLocation = false }: { rows: (FieldRow & { in?: string })[]; withLocation?: boolean }) {
  return (
    <table className="w-full text-left text-sm">
      <thead className="border-b border-slate-line text-xs uppercase tracking-wide text-ink-muted">
        <tr>
          <th className="py-2 pr-4 font-medium">Name</th>
          {withLocation ? <th className="pr-4 font-medium">In</th> : null}
          <th className="pr-4 font-medium">Type</th>
          <th className="pr-4 font-medium">Required</th>
          <th className="font-medium">Description</th>
        </tr>
      </thead>
      <tbody className="divide-y divide-slate-line">
        {rows.map((row) => (
          <tr key={`${row.in ?? ""}${row.name}`} className="align-top">
            <td className="py-2 pr-4">
              <code className="text-xs font-semibold text-ink">{row.name}</code>
            </td>
            {withLocation ? <td className="py-2 pr-4 text-ink-muted">{row.in}</td> : null}
            <td className="py-2 pr-4">
              <TypeText parts={row.type} />
            </td>
            <td className="py-2 pr-4 text-ink-muted">{row.required ? "yes" : "no"}</td>
            <td className="py-2 text-ink-soft">
              <DocText text={row.description} />
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
