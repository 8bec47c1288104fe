import { describe, expect, it } from "vitest";
import { z } from "zod";
import { AppError, toErrorResponse } from "./errors";

describe("the §9 error shape", () => {
  it("maps an AppError to its status with code, message and details", async () => {
    const response = toErrorResponse(new AppError("conflict", "Lot is released", { lot: "TW1" }));
    expect(response.status).toBe(409);
    expect(await response.json()).toEqual({ error: { code: "conflict", message: "Lot is released", details: { lot: "TW1" } } });
  });

  it("maps a zod failure to 422 with the path of every issue", async () => {
    const parsed = z.object({ reason: z.string().min(1), action: z.enum(["hold", "release"]) }).safeParse({ reason: "", action: "x" });
    const response = toErrorResponse(parsed.error);
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.code).toBe("unprocessable");
    expect(body.error.details.map((d: { path: string }) => d.path)).toEqual(["reason", "action"]);
  });

  it("hides an unexpected error behind a request id, leaking no stack or SQL", async () => {
    const original = console.error;
    console.error = () => undefined;
    const response = toErrorResponse(new Error('relation "secret_table" does not exist'));
    console.error = original;
    expect(response.status).toBe(500);
    const text = await response.text();
    expect(text).not.toContain("secret_table");
    expect(JSON.parse(text).error.code).toBe("internal");
  });
});
