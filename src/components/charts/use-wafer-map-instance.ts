import type { EChartsType } from "echarts/core";
import { useCallback, useEffect, useRef } from "react";
import type { DieRectMm } from "@/domain/wafer-map/layout";
import { chartImageApi, type ChartImageApi } from "./chart-export";
import { OVERLAY_ZLEVEL, plotRectPx, type WaferMapSize } from "./wafer-map-options";
import { selectionOverlay, type SelectionOverlay } from "./wafer-map-selection";

/**
 * The wafer map's hold on its echarts instance: hands `onReady` the PNG export, and keeps the selection overlay
 * on `cursorRect` (null hides it). Returns the ref to the instance and the `onChartReady` handler.
 */
export function useWaferMapInstance(size: WaferMapSize, cursorRect: DieRectMm | null, onReady?: (api: ChartImageApi) => void) {
  const instanceRef = useRef<EChartsType | null>(null);
  const overlayRef = useRef<SelectionOverlay | null>(null);
  const latest = useRef({ size, cursorRect, onReady });
  useEffect(() => {
    latest.current = { size, cursorRect, onReady };
  });

  const handleReady = useCallback((instance: EChartsType) => {
    instanceRef.current = instance;
    overlayRef.current = selectionOverlay(instance, (w, h) => plotRectPx(latest.current.size, w, h), OVERLAY_ZLEVEL);
    overlayRef.current.show(latest.current.cursorRect);
    latest.current.onReady?.(chartImageApi(instance));
  }, []);

  useEffect(() => {
    overlayRef.current?.show(cursorRect);
  }, [cursorRect]);

  return { instanceRef, handleReady };
}
