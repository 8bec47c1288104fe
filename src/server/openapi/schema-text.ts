import type { OpenApiDocument } from "./document";

type Components = NonNullable<OpenApiDocument["components"]>;
export type SchemaOrRef = NonNullable<Components["schemas"]>[string];
type Schema = Exclude<SchemaOrRef, { $ref: string }>;

/** A piece of a type as the docs page prints it; `ref` names a component schema to link to. */
export interface TypePart {
  text: string;
  ref?: string;
}

export interface FieldRow {
  name: string;
  type: TypePart[];
  required: boolean;
  description: string;
}

const refName = (ref: string) => ref.slice(ref.lastIndexOf("/") + 1);

export function isRef(value: unknown): value is { $ref: string } {
  return typeof value === "object" && value !== null && typeof (value as { $ref?: unknown }).$ref === "string";
}

/** The schema a local `#/components/schemas/X` reference points to; other references stay unresolved. */
export function resolveSchema(document: OpenApiDocument, schema: SchemaOrRef | undefined): Schema | undefined {
  if (!schema) return undefined;
  if (!isRef(schema)) return schema;
  const target = document.components?.schemas?.[refName(schema.$ref)];
  return target && !isRef(target) ? target : undefined;
}

function joined(parts: TypePart[][], separator: string): TypePart[] {
  return parts.flatMap((p, i) => (i === 0 ? p : [{ text: separator }, ...p]));
}

/** A short type for a table cell: `string (uuid)`, `integer | null`, `Die[]`, `"json" | "csv"`, `Record<string, integer>`. */
export function typeParts(schema: SchemaOrRef | undefined): TypePart[] {
  if (!schema) return [{ text: "any" }];
  if (isRef(schema)) return [{ text: refName(schema.$ref), ref: refName(schema.$ref) }];
  const variants = schema.oneOf ?? schema.anyOf;
  if (variants) return joined(variants.map((v) => typeParts(v)), " | ");
  if (schema.enum) return [{ text: schema.enum.map((v) => JSON.stringify(v)).join(" | ") }];
  const types = Array.isArray(schema.type) ? schema.type : schema.type ? [schema.type] : [];
  if (types.length === 0) return [{ text: "any" }];
  return joined(
    types.map((type): TypePart[] => {
      if (type === "array") {
        if (schema.prefixItems) return [{ text: "[" }, ...joined(schema.prefixItems.map((s) => typeParts(s)), ", "), { text: "]" }];
        const items = schema.items && typeof schema.items === "object" ? typeParts(schema.items) : [{ text: "any" }];
        return items.some((p) => p.text === " | ") ? [{ text: "(" }, ...items, { text: ")[]" }] : [...items, { text: "[]" }];
      }
      if (type === "object" && schema.additionalProperties && typeof schema.additionalProperties === "object") {
        return [{ text: "Record<string, " }, ...typeParts(schema.additionalProperties), { text: ">" }];
      }
      return [{ text: schema.format && type === "string" ? `string (${schema.format})` : type }];
    }),
    " | ",
  );
}

/** Bounds, pattern and default of a schema in words, e.g. `1–25`, `≤ 64 characters`, `default "json"`. */
export function constraintText(schema: SchemaOrRef | undefined): string {
  if (!schema || isRef(schema)) return "";
  const parts: string[] = [];
  const low = schema.minimum !== undefined ? `≥ ${schema.minimum}` : typeof schema.exclusiveMinimum === "number" ? `> ${schema.exclusiveMinimum}` : null;
  const high = schema.maximum !== undefined ? `≤ ${schema.maximum}` : typeof schema.exclusiveMaximum === "number" ? `< ${schema.exclusiveMaximum}` : null;
  if (schema.minimum !== undefined && schema.maximum !== undefined) parts.push(`${schema.minimum}–${schema.maximum}`);
  else if (low || high) parts.push([low, high].filter(Boolean).join(", "));
  if (schema.maxLength !== undefined) parts.push(`≤ ${schema.maxLength} characters`);
  if (schema.minItems !== undefined && schema.maxItems !== undefined) parts.push(`${schema.minItems}–${schema.maxItems} items`);
  else if (schema.minItems !== undefined) parts.push(`≥ ${schema.minItems} items`);
  else if (schema.maxItems !== undefined) parts.push(`≤ ${schema.maxItems} items`);
  if (schema.pattern) parts.push(`pattern ${schema.pattern}`);
  if (schema.default !== undefined) parts.push(`default ${JSON.stringify(schema.default)}`);
  return parts.join("; ");
}

/**
 * One row per property of an object schema (after resolving a reference), with the fields of inline nested
 * objects and arrays of objects as dotted rows (`error.code`, `sweep.biasV`, `wafers[].lot`); empty for a non-object.
 */
export function fieldRows(document: OpenApiDocument, schema: SchemaOrRef | undefined, prefix = ""): FieldRow[] {
  const resolved = resolveSchema(document, schema);
  if (!resolved?.properties) return [];
  const required = new Set(resolved.required ?? []);
  return Object.entries(resolved.properties).flatMap(([name, property]) => {
    const own = isRef(property) ? undefined : property;
    const row: FieldRow = {
      name: prefix + name,
      type: typeParts(property),
      required: required.has(name),
      description: [own?.description ?? "", constraintText(property)].filter(Boolean).join(". "),
    };
    const nested = own ? inlineObject(own) : undefined;
    return [row, ...(nested ? fieldRows(document, nested.schema, `${prefix}${name}${nested.suffix}.`) : [])];
  });
}

function inlineObject(schema: Schema): { schema: Schema; suffix: string } | undefined {
  const variants = (schema.oneOf ?? schema.anyOf ?? []).filter((v) => isRef(v) || v.type !== "null");
  const first = variants.length === 1 ? variants[0] : undefined;
  const single: Schema = first && !isRef(first) ? first : schema;
  if (single.properties) return { schema: single, suffix: "" };
  const items = single.items;
  if (items && !isRef(items) && items.properties) return { schema: items, suffix: "[]" };
  return undefined;
}

/** The alternatives of a oneOf/anyOf schema, each with its fields, e.g. the step and table device models. */
export function variantRows(document: OpenApiDocument, schema: SchemaOrRef | undefined): FieldRow[][] {
  const resolved = resolveSchema(document, schema);
  const variants = resolved?.oneOf ?? resolved?.anyOf ?? [];
  return variants.map((v) => fieldRows(document, v)).filter((rows) => rows.length > 0);
}
