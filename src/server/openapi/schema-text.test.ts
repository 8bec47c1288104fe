import { describe, expect, it } from "vitest";
import type { OpenApiDocument } from "./document";
import { constraintText, fieldRows, typeParts, variantRows } from "./schema-text";

const text = (parts: { text: string }[]) => parts.map((p) => p.text).join("");

const document = {
  openapi: "3.1.0",
  info: { title: "t", version: "1" },
  components: {
    schemas: {
      Die: { type: "object", properties: { x: { type: "integer" } }, required: ["x"] },
      Envelope: {
        type: "object",
        properties: {
          error: { type: "object", properties: { code: { type: "string" }, details: {} }, required: ["code"] },
          dies: { type: "array", items: { $ref: "#/components/schemas/Die" } },
          wafers: { type: ["array", "null"], items: { type: "object", properties: { slot: { type: "integer", minimum: 1, maximum: 25 } } } },
        },
        required: ["error"],
      },
      Model: {
        oneOf: [
          { type: "object", properties: { kind: { type: "string", enum: ["step"] }, modes: { type: "integer" } }, required: ["kind"] },
          { type: "object", properties: { kind: { type: "string", enum: ["table"] } } },
        ],
      },
    },
  },
} as OpenApiDocument;

describe("typeParts", () => {
  it("prints nullable 3.1 type arrays, formats, enums, records and tuples", () => {
    expect(text(typeParts({ type: ["integer", "null"] }))).toBe("integer | null");
    expect(text(typeParts({ type: "string", format: "uuid" }))).toBe("string (uuid)");
    expect(text(typeParts({ type: "string", enum: ["json", "csv"] }))).toBe('"json" | "csv"');
    expect(text(typeParts({ type: "object", additionalProperties: { type: "integer" } }))).toBe("Record<string, integer>");
    expect(text(typeParts({ type: "array", items: { type: "array", prefixItems: [{ type: "number" }, { type: "number" }] } }))).toBe("[number, number][]");
    expect(text(typeParts({}))).toBe("any");
  });

  it("links references by component name, also inside arrays and unions", () => {
    expect(typeParts({ type: "array", items: { $ref: "#/components/schemas/Die" } })).toEqual([{ text: "Die", ref: "Die" }, { text: "[]" }]);
    expect(text(typeParts({ oneOf: [{ $ref: "#/components/schemas/Model" }, { type: "null" }] }))).toBe("Model | null");
    expect(text(typeParts({ type: "array", items: { anyOf: [{ type: "string" }, { type: "number" }] } }))).toBe("(string | number)[]");
  });
});

describe("constraintText", () => {
  it("words inclusive and exclusive bounds, lengths, item counts and defaults", () => {
    expect(constraintText({ type: "integer", minimum: 1, maximum: 25 })).toBe("1–25");
    expect(constraintText({ type: "number", exclusiveMinimum: 0, maximum: 100 })).toBe("> 0, ≤ 100");
    expect(constraintText({ type: "string", maxLength: 64, default: "json" })).toBe('≤ 64 characters; default "json"');
    expect(constraintText({ type: "array", minItems: 1 })).toBe("≥ 1 items");
    expect(constraintText({ $ref: "#/components/schemas/Die" })).toBe("");
  });
});

describe("fieldRows", () => {
  it("resolves a reference and marks required fields", () => {
    expect(fieldRows(document, { $ref: "#/components/schemas/Die" })).toEqual([{ name: "x", type: [{ text: "integer" }], required: true, description: "" }]);
  });

  it("adds the fields of inline nested objects and object arrays as dotted rows, but not of referenced ones", () => {
    const rows = fieldRows(document, { $ref: "#/components/schemas/Envelope" });
    expect(rows.map((r) => r.name)).toEqual(["error", "error.code", "error.details", "dies", "wafers", "wafers[].slot"]);
    expect(rows.find((r) => r.name === "wafers[].slot")?.description).toBe("1–25");
    expect(rows.find((r) => r.name === "error.code")?.required).toBe(true);
  });

  it("answers no rows for a schema without properties or an unknown reference", () => {
    expect(fieldRows(document, { type: "string" })).toEqual([]);
    expect(fieldRows(document, { $ref: "#/components/schemas/Missing" })).toEqual([]);
  });
});

describe("variantRows", () => {
  it("lists each alternative of a oneOf with its own fields", () => {
    const variants = variantRows(document, { $ref: "#/components/schemas/Model" });
    expect(variants.map((rows) => rows.map((r) => r.name))).toEqual([["kind", "modes"], ["kind"]]);
  });
});
