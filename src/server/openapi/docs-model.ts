import type { OpenApiDocument } from "./document";
import { constraintText, type FieldRow, fieldRows, isRef, resolveSchema, type SchemaOrRef, type TypePart, typeParts, variantRows } from "./schema-text";

// What the /docs/api page prints, read from the generated document so the page and /api/openapi cannot disagree.

interface ParameterRow extends FieldRow {
  in: string;
}

interface BodyView {
  contentTypes: string[];
  description: string;
  type: TypePart[];
  fields: FieldRow[];
  variants: FieldRow[][];
}

interface ResponseRow {
  status: string;
  description: string;
  contentTypes: string[];
  type: TypePart[];
}

export interface OperationView {
  anchor: string;
  method: string;
  path: string;
  summary: string;
  description: string;
  roles: string[] | null;
  parameters: ParameterRow[];
  body: BodyView | null;
  responses: ResponseRow[];
  curl: string;
}

interface TagView {
  name: string;
  description: string;
  operations: OperationView[];
}

const METHODS = ["get", "post", "put", "patch", "delete"] as const;
type PathItem = NonNullable<OpenApiDocument["paths"]>[string];
type Operation = NonNullable<PathItem["get"]>;
type MediaMap = Record<string, { schema?: SchemaOrRef; example?: unknown }>;

function resolveComponent<T>(document: OpenApiDocument, value: T, kind: "parameters" | "responses"): Exclude<T, { $ref: string }> | undefined {
  if (!isRef(value)) return value as Exclude<T, { $ref: string }>;
  const name = value.$ref.slice(value.$ref.lastIndexOf("/") + 1);
  const target = (document.components?.[kind] as Record<string, unknown> | undefined)?.[name];
  return target && !isRef(target) ? (target as Exclude<T, { $ref: string }>) : undefined;
}

function parameterRows(document: OpenApiDocument, operation: Operation): ParameterRow[] {
  return (operation.parameters ?? []).flatMap((p) => {
    const parameter = resolveComponent(document, p, "parameters");
    if (!parameter) return [];
    const description = [parameter.description ?? "", constraintText(parameter.schema)].filter(Boolean).join(". ");
    return [{ name: parameter.name, in: parameter.in, type: typeParts(parameter.schema), required: parameter.required ?? false, description }];
  });
}

function firstSchema(content: MediaMap | undefined): SchemaOrRef | undefined {
  return content ? Object.values(content).find((m) => m.schema)?.schema : undefined;
}

function bodyView(document: OpenApiDocument, operation: Operation): BodyView | null {
  const body = operation.requestBody;
  if (!body || isRef(body)) return null;
  const content = body.content as MediaMap;
  const json = content["application/json"]?.schema;
  const schema = json ?? firstSchema(content);
  return {
    contentTypes: Object.keys(content),
    description: body.description ?? resolveSchema(document, schema)?.description ?? "",
    type: typeParts(schema),
    fields: fieldRows(document, json ?? content["multipart/form-data"]?.schema),
    variants: json ? variantRows(document, json) : [],
  };
}

function responseRows(document: OpenApiDocument, operation: Operation): ResponseRow[] {
  return Object.entries(operation.responses ?? {})
    .sort(([a], [b]) => a.localeCompare(b))
    .flatMap(([status, raw]) => {
      const response = resolveComponent(document, raw as { description?: string; content?: MediaMap } | { $ref: string }, "responses");
      if (!response) return [];
      const content = response.content;
      return [{ status, description: response.description ?? "", contentTypes: Object.keys(content ?? {}), type: content ? typeParts(firstSchema(content)) : [] }];
    });
}

const shellQuote = (text: string) => `'${text.replace(/'/g, `'\\''`)}'`;

/** An example call: path parameters from their examples, Bearer auth unless the operation is public. */
function curlExample(document: OpenApiDocument, baseUrl: string, method: string, path: string, operation: Operation): string {
  const examples = new Map(parameterRowsWithExamples(document, operation));
  const url = baseUrl.replace(/\/$/, "") + path.replace(/\{(\w+)\}/g, (_m, name: string) => encodeURIComponent(String(examples.get(name) ?? `<${name}>`)));
  const lines = [method === "get" ? `curl ${shellQuote(url)}` : `curl -X ${method.toUpperCase()} ${shellQuote(url)}`];
  const isPublic = Array.isArray(operation.security) && operation.security.length === 0;
  if (!isPublic) lines.push(`-H 'Authorization: Bearer <key>'`);
  else if (path.endsWith("/session")) lines.push(method === "post" ? "-c cookies.txt" : "-b cookies.txt");
  const body = operation.requestBody && !isRef(operation.requestBody) ? (operation.requestBody.content as MediaMap) : null;
  if (body?.["application/json"]) {
    lines.push(`-H 'Content-Type: application/json'`, `-d ${shellQuote(JSON.stringify(body["application/json"].example ?? {}))}`);
  } else if (body?.["text/csv"]) {
    lines.push(`-H 'Content-Type: text/csv'`, "--data-binary @lot.csv");
  }
  return lines.join(" \\\n  ");
}

function parameterRowsWithExamples(document: OpenApiDocument, operation: Operation): [string, unknown][] {
  return (operation.parameters ?? []).flatMap((p) => {
    const parameter = resolveComponent(document, p, "parameters");
    const schema = parameter?.schema && !isRef(parameter.schema) ? parameter.schema : undefined;
    const example = parameter?.example ?? schema?.example;
    return parameter && example !== undefined ? [[parameter.name, example] as [string, unknown]] : [];
  });
}

/** Every operation of the document, grouped by its first tag in the document's tag order. */
export function operationsByTag(document: OpenApiDocument, baseUrl: string): TagView[] {
  const tags: TagView[] = (document.tags ?? []).map((t) => ({ name: t.name, description: t.description ?? "", operations: [] }));
  for (const [path, item] of Object.entries(document.paths ?? {})) {
    for (const method of METHODS) {
      const operation = item[method];
      if (!operation) continue;
      const tagName = operation.tags?.[0] ?? "Other";
      let tag = tags.find((t) => t.name === tagName);
      if (!tag) tags.push((tag = { name: tagName, description: "", operations: [] }));
      const roles = (operation as Operation & { "x-roles"?: string[] })["x-roles"];
      tag.operations.push({
        anchor: operation.operationId ?? `${method}-${path}`.replace(/[^\w-]+/g, "-"),
        method: method.toUpperCase(),
        path,
        summary: operation.summary ?? "",
        description: operation.description ?? "",
        roles: roles ?? null,
        parameters: parameterRows(document, operation),
        body: bodyView(document, operation),
        responses: responseRows(document, operation),
        curl: curlExample(document, baseUrl, method, path, operation),
      });
    }
  }
  return tags.filter((t) => t.operations.length > 0);
}

/** The component schemas with their fields (or variants), for the schema reference at the end of the page. */
export function schemaViews(document: OpenApiDocument): { name: string; description: string; type: TypePart[]; fields: FieldRow[]; variants: FieldRow[][] }[] {
  return Object.entries(document.components?.schemas ?? {}).map(([name, schema]) => ({
    name,
    description: resolveSchema(document, schema)?.description ?? "",
    type: typeParts(isRef(schema) ? schema : { ...schema, description: undefined }),
    fields: fieldRows(document, schema),
    variants: variantRows(document, schema),
  }));
}
