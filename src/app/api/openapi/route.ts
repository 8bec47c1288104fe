import { publicRoute } from "@/server/http/route";
import { buildOpenApiDocument, type OpenApiDocument } from "@/server/openapi/document";

// Built once per server process: the document depends only on the code.
let cached: OpenApiDocument | null = null;

export const GET = publicRoute(async () => Response.json((cached ??= buildOpenApiDocument())));
