import EChartsReactCoreImport from "echarts-for-react/lib/core";

// lib/core is CommonJS with `exports.default`. Importers inside a "type": "module" package may be handed the
// whole exports object under Node's interop rules (seen with Vite/Rolldown), others the class itself; accept both.
const interop = EChartsReactCoreImport as typeof EChartsReactCoreImport & { default?: typeof EChartsReactCoreImport };

/** The echarts-for-react core component (fed `echarts={echarts}` from ./echarts-setup, so only registered parts load). */
export const ReactEChartsCore = interop.default ?? EChartsReactCoreImport;
