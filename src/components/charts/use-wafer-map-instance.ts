import type { EChartsType } from "echarts/core";
import { useCallback, useEffect, useRef } from "react";
import type { DieRectMm } from "@/domain/wafer-map/layout";
import { chartImageApi, type ChartImageApi } from "./chart-export";
import { attachFieldPointer, type FieldPointer } from "./field-pointer";
import { OVERLAY_ZLEVEL, plotRectPx, type WaferMapSize } from "./wafer-map-options";
import { selectionOverlay, type SelectionOverlay } from "./wafer-map-selection";

/**
 * The wafer map's hold on its echarts instance: hands `onReady` the PNG export, keeps the selection overlay on
 * `cursorRect` (null hides it), and routes the pointer (move, leave, click, legend toggles) to `pointer`, which
 * finds the die under it with its own hit test (the die fields are rasters, not chart elements). Returns the ref
 * to the instance and the `onChartReady` handler.
 */
export function useWaferMapInstance(size: WaferMapSize, cursorRect: DieRectMm | null, onReady?: (api: ChartImageApi) => void, pointer?: FieldPointer) {
  const instanceRef = useRef<EChartsType | null>(null);
  const overlayRef = useRef<SelectionOverlay | null>(null);
  const latest = useRef({ size, cursorRect, onReady, pointer });
  useEffect(() => {
    latest.current = { size, cursorRect, onReady, pointer };
  });

  const handleReady = useCallback((instance: EChartsType) => {
    instanceRef.current = instance;
    overlayRef.current = selectionOverlay(instance, (w, h) => plotRectPx(latest.current.size, w, h), OVERLAY_ZLEVEL);
    overlayRef.current.show(latest.current.cursorRect);
    latest.current.onReady?.(chartImageApi(instance));

    attachFieldPointer(instance, (w, h) => plotRectPx(latest.current.size, w, h), () => latest.current.pointer);
  }, []);

  useEffect(() => {
    overlayRef.current?.show(cursorRect);
  }, [cursorRect]);

  return { instanceRef, handleReady };
}
