import "server-only";
import { extendZodWithOpenApi } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";

// zod 4 copies prototype methods onto each instance when it is built, so `.openapi()` exists only on schemas
// created after this call. Every schema file of the document imports `z` from here to get that order; schemas
// shared from src/lib/schemas/ predate it and are cloned (describeFields, named) before they are registered.
extendZodWithOpenApi(z);

export { z };

/** A copy of a shared object schema with a description on the named fields; validation is unchanged. */
export function describeFields<T extends z.ZodObject>(schema: T, descriptions: Partial<Record<keyof T["shape"] & string, string>>): T {
  const shape = schema.shape as Record<string, z.ZodType>;
  const described: Record<string, z.ZodType> = {};
  for (const [key, text] of Object.entries(descriptions)) {
    const field = shape[key];
    if (!field || typeof text !== "string") throw new Error(`describeFields: the schema has no field "${key}"`);
    described[key] = field.describe(text);
  }
  return schema.safeExtend(described) as unknown as T;
}

/** A shared schema registered under components/schemas/{refId}: cloned first, so it carries `.openapi()`. */
export function named<T extends z.ZodType>(refId: string, schema: T, description: string): T {
  return schema.describe(description).openapi(refId);
}

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;

/**
 * Compile-time guard for a response schema that mirrors an interface the code returns (LotDetail, DieRecord…):
 * the call fails to type-check when the two stop being mutually assignable, so the document cannot drift.
 */
export function mirrors<T>() {
  return <S extends z.ZodType>(schema: S, ..._same: Same<z.output<S>, T> extends true ? [] : [schemaDiffersFromInterface: never]): S => schema;
}
