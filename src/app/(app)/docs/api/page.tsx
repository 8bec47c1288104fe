import type { Metadata } from "next";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { env } from "@/server/env";
import { buildOpenApiDocument, type OpenApiDocument } from "@/server/openapi/document";
import { operationsByTag, schemaViews } from "@/server/openapi/docs-model";
import { DocText, FieldTable, TypeText } from "./field-table";
import { OperationSection } from "./operation-section";

export const metadata: Metadata = { title: "API reference" };

// Built once per server process, like /api/openapi: the document depends only on the code.
let cached: OpenApiDocument | null = null;

export default async function ApiDocsPage() {
  await requireContext();
  const document = (cached ??= buildOpenApiDocument());
  const tags = operationsByTag(document, env.APP_URL);
  const schemas = schemaViews(document);
  return (
    <>
      <PageHeader eyebrow="Reference" title={`${document.info.title} ${document.info.version}`}>
        <a href="/api/openapi" className="rounded border border-slate-line bg-slate-panel px-3 py-1.5 text-sm font-medium text-ink hover:bg-slate-wash">
          OpenAPI document (JSON)
        </a>
      </PageHeader>

      <div className="grid gap-6 xl:grid-cols-[260px_1fr]">
        <nav aria-label="Operations" className="self-start text-sm xl:sticky xl:top-6">
          {tags.map((tag) => (
            <div key={tag.name} className="mb-4">
              <a href={`#tag-${tag.name}`} className="font-semibold text-ink hover:underline">
                {tag.name}
              </a>
              <ul className="mt-1 space-y-1">
                {tag.operations.map((op) => (
                  <li key={op.anchor}>
                    <a href={`#${op.anchor}`} className="flex items-center gap-2 text-ink-soft hover:text-accent">
                      <span className="w-12 text-[0.65rem] font-semibold text-ink-muted">{op.method}</span>
                      <span className="truncate">{op.summary}</span>
                    </a>
                  </li>
                ))}
              </ul>
            </div>
          ))}
          <a href="#schemas" className="font-semibold text-ink hover:underline">
            Schemas
          </a>
        </nav>

        <div className="min-w-0 space-y-8">
          <Panel>
            <div className="max-w-4xl space-y-3 text-sm text-ink-soft">
              {(document.info.description ?? "").split("\n\n").map((paragraph) => (
                <p key={paragraph}>
                  <DocText text={paragraph} />
                </p>
              ))}
            </div>
          </Panel>

          {tags.map((tag) => (
            <section key={tag.name} id={`tag-${tag.name}`} className="scroll-mt-6 space-y-4">
              <div>
                <h2 className="text-lg font-semibold text-ink">{tag.name}</h2>
                {tag.description ? <p className="text-sm text-ink-soft">{tag.description}</p> : null}
              </div>
              {tag.operations.map((op) => (
                <OperationSection key={op.anchor} operation={op} />
              ))}
            </section>
          ))}

          <section id="schemas" className="scroll-mt-6 space-y-4">
            <h2 className="text-lg font-semibold text-ink">Schemas</h2>
            {schemas.map((schema) => (
              <div key={schema.name} id={`schema-${schema.name}`} className="scroll-mt-6 rounded-lg border border-slate-line bg-slate-panel p-5">
                <h3 className="flex items-baseline gap-3 text-base font-semibold text-ink">
                  {schema.name}
                  {schema.fields.length === 0 ? <TypeText parts={schema.type} /> : null}
                </h3>
                {schema.description ? (
                  <p className="mb-2 mt-1 text-sm text-ink-soft">
                    <DocText text={schema.description} />
                  </p>
                ) : null}
                {schema.fields.length > 0 ? <FieldTable rows={schema.fields} /> : null}
                {schema.variants.map((rows, i) => (
                  <div key={i} className="mt-3">
                    <p className="mb-1 text-xs font-medium text-ink-muted">{i === 0 ? "One of:" : "or:"}</p>
                    <FieldTable rows={rows} />
                  </div>
                ))}
              </div>
            ))}
          </section>
        </div>
      </div>
    </>
  );
}
