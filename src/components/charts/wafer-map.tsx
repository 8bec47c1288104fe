"use client";

import { useEffect, useMemo, useRef, useState, type KeyboardEvent } from "react";
import { TOOLTIP_BOX_CLASS } from "./chart-theme";
import { dieSummaryText } from "@/domain/wafer-map/die-summary";
import { mapLayout } from "@/domain/wafer-map/layout";
import type { MapDie, MapGeometry } from "@/domain/wafer-map/map-die";
import { findDie, nearestDie, stepDie, type MapDirection } from "@/domain/wafer-map/navigation";
import type { ConductanceUnit } from "@/domain/wafer-map/units";
import type { ChartImageApi } from "./chart-export";
import { echarts } from "./echarts-setup";
import { ReactEChartsCore } from "./react-echarts";
import { chartPixel, placeTooltip, type FieldPointer } from "./field-pointer";
import { useWaferMapInstance } from "./use-wafer-map-instance";
import { dieTooltipHtml } from "./wafer-map-labels";
import { buildWaferMap, LARGE_ASPECT_RATIO, type WaferMapColouring, type WaferMapSize } from "./wafer-map-options";

export interface WaferMapProps {
  /** Keep the array stable between renders: a new array re-lays the map and resets the cursor to `selected`. */
  dies: readonly MapDie[];
  geometry: MapGeometry;
  colourBy: WaferMapColouring;
  unit: ConductanceUnit;
  /** Grid position of the selected die; the keyboard cursor starts here and follows it. */
  selected?: { x: number; y: number } | null;
  /** Called with the die on click, Enter or Space (large map only). */
  onSelect?: (die: MapDie) => void;
  size?: WaferMapSize;
  ariaLabel: string;
  /** Colour-scale range in S; default the 2nd–98th percentile of the wafer's conductances. */
  valueRange?: { minS: number; maxS: number } | null;
  /** Receives the PNG export once the chart is drawn. */
  onReady?: (api: ChartImageApi) => void;
  className?: string;
}

const ARROWS: Readonly<Record<string, MapDirection>> = { ArrowLeft: "left", ArrowRight: "right", ArrowUp: "up", ArrowDown: "down" };
// Series, legends and scales change with the colouring; replacing them (matched by id) keeps the zoom.
const REPLACE_MERGE = ["series", "visualMap", "legend", "graphic", "dataZoom"];
const CHART_STYLE = { width: "100%", height: "100%" };

/**
 * Wafer map on canvas: every die a rectangle in true aspect, coloured by conductance (cividis) or by bin
 * (Okabe–Ito); out-of-window dies ringed, inked dies hatched, the selected die outlined. The dies are painted as
 * rasters (one per colour group) under the chart's outline, legend and zoom, so 20,000 dies draw in a few ms.
 * The large map zooms and pans (wheel, drag), shows a tooltip for the die under the pointer and is focusable:
 * arrow keys move the cursor die by die, Enter opens it. The small map is a silent thumbnail whose parent
 * handles the click. The container exposes `data-die-count`, `data-flagged-count` (out-of-window dies),
 * `data-flagged-drawn` (rings the last paint put on screen) and `data-inked-count`.
 */
export function WaferMap(props: WaferMapProps) {
  const { dies, geometry, colourBy, unit, selected = null, onSelect, size = "large", ariaLabel, valueRange, onReady } = props;
  const large = size === "large";
  const { dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm } = geometry;
  const layout = useMemo(
    () => mapLayout(dies, { dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm }),
    [dies, dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm],
  );
  const minS = valueRange?.minS;
  const maxS = valueRange?.maxS;
  const model = useMemo(
    () => buildWaferMap({ dies, layout, colourBy, unit, size, valueRange: minS !== undefined && maxS !== undefined ? { minS, maxS } : null }),
    [dies, layout, colourBy, unit, size, minS, maxS],
  );

  // The cursor follows the `selected` prop, and moves on its own with the keyboard or a click.
  const selectedKey = selected ? `${selected.x},${selected.y}` : null;
  const [cursor, setCursor] = useState<number | null>(() => findDie(dies, selected));
  const [synced, setSynced] = useState({ selectedKey, dies });
  if (synced.selectedKey !== selectedKey || synced.dies !== dies) {
    setSynced({ selectedKey, dies });
    setCursor(findDie(dies, selected));
  }
  const cursorDie = cursor === null ? undefined : dies[cursor];
  const cursorRect = cursor === null ? null : (layout.rects[cursor] ?? null);
  const containerRef = useRef<HTMLDivElement>(null);
  const tooltipRef = useRef<HTMLDivElement>(null);
  const hiddenRef = useRef<ReadonlySet<string>>(new Set());
  const onSelectRef = useRef(onSelect);
  useEffect(() => {
    onSelectRef.current = onSelect;
  });

  // The pointer's die and the tooltip are handled outside React: a move costs a hit test and, when the die
  // changes, one innerHTML, never a re-render of the map.
  const pointer = useMemo((): FieldPointer | undefined => {
    if (!large) return undefined;
    const tag = Math.random().toString(36).slice(2); // tooltip keys of this dies/unit only
    const fieldOf = (i: number) => (colourBy === "bin" ? (dies[i]?.bin ?? "") : "Dies");
    const showTip = (index: number | null, x: number, y: number) => {
      const tip = tooltipRef.current;
      const box = containerRef.current;
      if (!tip || !box) return;
      const die = index === null || hiddenRef.current.has(fieldOf(index)) ? undefined : dies[index];
      placeTooltip(tip, box, x, y, die ? `${tag}:${index}` : null, () => (die ? dieTooltipHtml(die, unit) : ""));
    };
    return {
      dieAt: model.dieAt,
      hover: showTip,
      click: (index) => {
        const die = dies[index];
        if (die === undefined || hiddenRef.current.has(fieldOf(index))) return;
        setCursor(index);
        onSelectRef.current?.(die);
      },
      legend: (hidden) => {
        hiddenRef.current = hidden;
        showTip(null, 0, 0);
      },
      rendered: () => {
        if (containerRef.current) containerRef.current.dataset.flaggedDrawn = String(model.drawn(hiddenRef.current).rings);
      },
    };
  }, [large, model, dies, colourBy, unit]);
  const { instanceRef, handleReady } = useWaferMapInstance(size, cursorRect, onReady, pointer);

  // Once the cursor has moved by keyboard, point the tooltip at it.
  const keyboardMove = useRef(false);
  useEffect(() => {
    if (!keyboardMove.current || cursor === null) return;
    keyboardMove.current = false;
    const rect = layout.rects[cursor];
    const instance = instanceRef.current;
    const at = rect && instance ? chartPixel(instance, rect.centreXMm, rect.centreYMm) : null;
    if (at) pointer?.hover(cursor, at[0], at[1]);
  }, [cursor, layout, pointer, instanceRef]);

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const direction = ARROWS[event.key];
    if (direction !== undefined) {
      event.preventDefault();
      keyboardMove.current = true;
      setCursor(cursor === null ? nearestDie(dies, layout.centre) : stepDie(dies, cursor, direction));
    } else if ((event.key === "Enter" || event.key === " ") && cursorDie !== undefined) {
      event.preventDefault();
      onSelect?.(cursorDie);
    } else if (event.key === "Escape") {
      pointer?.hover(null, 0, 0);
    }
  };

  return (
    <div
      ref={containerRef}
      role={large ? "application" : "img"}
      aria-roledescription={large ? "wafer map" : undefined}
      aria-label={ariaLabel}
      tabIndex={large ? 0 : undefined}
      onKeyDown={large ? onKeyDown : undefined}
      data-die-count={model.dieCount}
      data-flagged-count={model.flaggedCount}
      data-inked-count={model.inkedCount}
      data-selected={props.selected ? `${props.selected.x},${props.selected.y}` : ""}
      className={`relative w-full rounded focus:outline-none focus-visible:ring-2 focus-visible:ring-accent/50 ${props.className ?? ""}`}
      style={{ aspectRatio: large ? String(LARGE_ASPECT_RATIO) : "1" }}
    >
      <ReactEChartsCore
        echarts={echarts}
        option={model.option}
        replaceMerge={REPLACE_MERGE}
        onChartReady={handleReady}
        style={CHART_STYLE}
      />
      {large ? <div ref={tooltipRef} role="tooltip" hidden className={`pointer-events-none absolute left-0 top-0 z-10 ${TOOLTIP_BOX_CLASS}`} /> : null}
      {large ? (
        <p aria-live="polite" className="sr-only">
          {cursorDie ? dieSummaryText(cursorDie, unit) : ""}
        </p>
      ) : null}
    </div>
  );
}
