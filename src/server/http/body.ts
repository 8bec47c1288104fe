import "server-only";
import { AppError } from "./errors";

/** Reads a JSON body, answering 415 for another content type and 400 for JSON that does not parse. */
export async function readJson(request: Request, maxBytes = 1_000_000): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.includes("application/json")) throw new AppError("unsupported_media_type", "Send the body as application/json");
  const text = await request.text();
  if (text.length > maxBytes) throw new AppError("too_large", `The JSON body is larger than ${maxBytes} bytes`);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("invalid", "The body is not valid JSON");
  }
}
