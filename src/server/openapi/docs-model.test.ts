import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "./document";
import { operationsByTag, schemaViews } from "./docs-model";

const document = buildOpenApiDocument();
const tags = operationsByTag(document, "https://lotwarden.example/");
const byId = new Map(tags.flatMap((t) => t.operations).map((op) => [op.anchor, op]));

describe("operationsByTag", () => {
  it("shows every operation of the document once, under the document's tags in their order", () => {
    const count = Object.values(document.paths ?? {}).reduce((n, item) => n + ["get", "post", "put", "patch", "delete"].filter((m) => m in item).length, 0);
    expect(byId.size).toBe(count);
    const order = (document.tags ?? []).map((t) => t.name).filter((name) => tags.some((t) => t.name === name));
    expect(tags.map((t) => t.name)).toEqual(order);
  });

  it("lists path and query parameters with their location, requiredness and bounds", () => {
    const dies = byId.get("listDies")!;
    expect(dies.parameters[0]).toMatchObject({ name: "lot", in: "path", required: true });
    expect(dies.parameters.find((p) => p.name === "wafer")).toMatchObject({ in: "query", required: false, description: expect.stringContaining("1–25") });
  });

  it("resolves shared error responses to their descriptions", () => {
    const notFound = byId.get("getLot")!.responses.find((r) => r.status === "404")!;
    expect(notFound.description).toMatch(/^404 not found/);
    expect(notFound.type).toEqual([{ text: "Error", ref: "Error" }]);
  });

  it("shows body fields and the alternatives of a union body", () => {
    expect(byId.get("signIn")!.body?.fields.map((f) => f.name)).toEqual(["email", "password", "tenant"]);
    expect(byId.get("freezeLimitSet")!.body?.variants.map((rows) => rows.map((r) => r.name))).toEqual([["lots"], ["from", "to"]]);
    expect(byId.get("ingestLot")!.body?.contentTypes).toEqual(["text/csv", "multipart/form-data"]);
  });

  it("builds curl examples with Bearer auth, encoded example path values and the body", () => {
    expect(byId.get("getLot")!.curl).toBe("curl 'https://lotwarden.example/api/v1/lots/TW2611-0147' \\\n  -H 'Authorization: Bearer <key>'");
    expect(byId.get("ingestLot")!.curl).toContain("--data-binary @lot.csv");
    expect(byId.get("setDisposition")!.curl).toContain(`-d '{"action":"release"`);
    expect(byId.get("getHealth")!.curl).toBe("curl 'https://lotwarden.example/api/health'");
    expect(byId.get("signIn")!.curl).not.toContain("Authorization");
  });

  it("names the roles of authenticated operations and none for public ones", () => {
    expect(byId.get("createCustomer")!.roles).toEqual(["admin"]);
    expect(byId.get("getHealth")!.roles).toBeNull();
  });
});

describe("schemaViews", () => {
  it("lists every component schema, with the Error envelope's nested fields", () => {
    const views = schemaViews(document);
    expect(views.map((v) => v.name)).toEqual(Object.keys(document.components?.schemas ?? {}));
    expect(views.find((v) => v.name === "Error")!.fields.map((f) => f.name)).toEqual(["error", "error.code", "error.message", "error.details"]);
  });
});
