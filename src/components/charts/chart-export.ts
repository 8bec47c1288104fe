import type { EChartsType } from "echarts/core";
import { downloadUrl } from "@/lib/download";

/** What a chart hands its parent once it is drawn (via `onReady`), e.g. for a "Download PNG" button. */
export interface ChartImageApi {
  /** The chart as a PNG data URL at twice the screen resolution, on a white background. */
  toPngDataUrl(): string;
  /** Saves the PNG through a temporary download link; `fileName` should end in ".png". */
  downloadPng(fileName: string): void;
}

/** Wraps an echarts instance's `getDataURL` for PNG export; browser only (creates an anchor to download). */
export function chartImageApi(instance: EChartsType): ChartImageApi {
  const toPngDataUrl = () => instance.getDataURL({ type: "png", pixelRatio: 2, backgroundColor: "#ffffff" });
  return {
    toPngDataUrl,
    downloadPng: (fileName: string) => downloadUrl(toPngDataUrl(), fileName),
  };
}
