import { describe, expect, it } from "vitest";
import { checkHealth } from "./health";

describe("health against the real local services", () => {
  it("reports the database, object store and mail relay as up", async () => {
    const health = await checkHealth();
    expect(health.services).toEqual({ database: { status: "up" }, objectStore: { status: "up" }, mailRelay: { status: "up" } });
    expect(health.status).toBe("ok");
  });
});
