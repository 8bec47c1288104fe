export {
  BOLTZMANN_JK,
  CONDUCTANCE_QUANTUM_S,
  ELEMENTARY_CHARGE_C,
  PLANCK_JS,
  thermalEnergyEv,
  thermalVoltageV,
} from "./constants";
export { fermiOccupation, thermalBroadeningFwhmEv, thermalBroadeningPerEv } from "./fermi";
export { integrateAdaptive, integrateAgainstThermalBroadening, type QuadratureOptions, type QuadratureResult } from "./quadrature";
export {
  conductanceFunctionS,
  expectedConductance,
  suggestedWindowV,
  type DeviceModel,
  type ExpectedConductance,
  type StepDeviceModel,
  type TableDeviceModel,
} from "./device-model";
export { stepConductanceClosedFormS, stepCurrentClosedFormA } from "./step-closed-form";
export { DeviceModelTableError, parseConductanceTable } from "./conductance-table";
export { fitLinearResponse, type LinearFit } from "./linear-fit";
export { fitCubic, nonlinearityIndex, type CubicFit } from "./cubic-fit";
export {
  analyzeDie,
  analyzeDieArrays,
  BINS,
  DEFAULT_EXTRACTION,
  type Bin,
  type DieResult,
  type ExtractionSettings,
  type IvPoint,
} from "./linear-response";
