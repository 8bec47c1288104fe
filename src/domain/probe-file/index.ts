export { fragmentItems, readProbeFile, readProbeFileBatches, type ProbeFileBatchItem } from "./read-probe-file";
export { type FragmentBatch, FragmentBatchWriter, transferables, unpackFragments } from "./fragment-batch";
export { ProbeFileError, type ProbeFileErrorCode } from "./probe-file-error";
export {
  DEFAULT_ERROR_BUDGET_FRACTION,
  MAX_KEPT_WARNINGS,
  type BiasUnit,
  type CurrentUnit,
  type DieFragment,
  type ProbeFileHeader,
  type ProbeFileItem,
  type ProbeFileSummary,
  type ReadOptions,
  type RowWarning,
} from "./probe-file-types";
