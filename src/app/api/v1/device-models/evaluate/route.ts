import { DeviceModelError, evaluateDeviceModel } from "@/domain/device-model";
import { evaluateRequestSchema, type EvaluateResponse } from "@/lib/schemas/device-models";
import { readJson } from "@/server/http/body";
import { AppError } from "@/server/http/errors";
import { apiRoute } from "@/server/http/route";

export const POST = apiRoute({ permission: "data.read" }, async ({ request }) => {
  const input = evaluateRequestSchema.parse(await readJson(request));
  let evaluation: EvaluateResponse;
  try {
    evaluation = evaluateDeviceModel(input);
  } catch (error) {
    if (!(error instanceof DeviceModelError)) throw error;
    throw new AppError("unprocessable", `${error.path}: ${error.message}`, [{ path: error.path, message: error.message }]);
  }
  return Response.json(evaluation);
});
