export { DeviceModelError } from "./device-model-error";
export {
  DEFAULT_WINDOW_FACTOR,
  evaluateDeviceModel,
  expectedShift,
  type DeviceModelEvaluation,
  type EvaluationRequest,
  type ExpectedPoint,
  type ExpectedShift,
  type TemperatureEvaluation,
} from "./evaluate";
export { curves, type ConductanceSample, type CurveOptions, type DeviceModelCurves, type EnergySample } from "./curves";
