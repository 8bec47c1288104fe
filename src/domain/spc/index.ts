// Public API of the SPC module: chart constants, robust statistics, die windows, control charts,
// baseline limit sets, run rules and capability indices.

export { type CapabilityInput, type CapabilitySummaryInput, type Capability, capability, capabilityFromSummary } from "./capability";
export {
  type IndividualsChart,
  type XbarSChart,
  type XbarSLimits,
  type XbarSPoint,
  type SubgroupStats,
  type ZoneBoundaries,
  individualsChart,
  xbarSChart,
  xbarSChartFromStats,
  xbarSLimits,
  zoneBoundaries,
} from "./charts";
export { type ChartConstants, c4, chartConstants } from "./constants";
export { type DieWindow, isOutOfWindow, patDieWindow, staticDieWindow } from "./die-window";
export {
  type BaselineLimitValues,
  type BaselineWafer,
  type FrozenIndividualsLimits,
  type FrozenMetricLimits,
  type FrozenXbarSLimits,
  limitSetFromBaseline,
} from "./limit-set";
export { type NormalityHint, NORMALITY_ALPHA, NORMALITY_MIN_VALUES, normalityHint } from "./normality";
export { AEC_Q001_IQR_DIVISOR, MAD_NORMAL_CONSISTENCY, iqrSigma, madSigma, median, quantile } from "./robust";
export {
  type RuleCheck,
  type RuleId,
  type RuleSet,
  type RuleViolation,
  RULE_DESCRIPTIONS,
  evaluateRules,
  nelsonRule1,
  nelsonRule2,
  nelsonRule3,
  nelsonRule4,
  nelsonRule5,
  nelsonRule6,
  nelsonRule7,
  nelsonRule8,
  westernElectricRule1,
  westernElectricRule2,
  westernElectricRule3,
  westernElectricRule4,
} from "./rules";
export { type GroupSummary, combineGroupSummaries } from "./sample-stats";
export { normalCdf, normalQuantile } from "./special-functions";
