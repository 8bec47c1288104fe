import type { GridPoint } from "../yield/geometry";

/** Arrow-key directions on the map; "up" is +y (die_y grows upward, away from the notch). */
export type MapDirection = "left" | "right" | "up" | "down";

const STEP: Readonly<Record<MapDirection, { axis: "x" | "y"; sign: 1 | -1 }>> = {
  left: { axis: "x", sign: -1 },
  right: { axis: "x", sign: 1 },
  up: { axis: "y", sign: 1 },
  down: { axis: "y", sign: -1 },
};

/**
 * Index of the next die from dies[fromIndex] in a direction: the nearest die in the same row (left/right) or
 * column (up/down) strictly beyond it, skipping gaps in the grid. Stays at fromIndex at the end of a row or
 * column; RangeError when fromIndex is not an index of dies.
 */
export function stepDie(dies: readonly GridPoint[], fromIndex: number, direction: MapDirection): number {
  const from = dies[fromIndex];
  if (from === undefined) throw new RangeError(`no die at index ${fromIndex} of ${dies.length}`);
  const { axis, sign } = STEP[direction];
  const across = axis === "x" ? "y" : "x";
  let best = fromIndex;
  let bestDistance = Infinity;
  dies.forEach((die, i) => {
    if (die[across] !== from[across]) return;
    const distance = (die[axis] - from[axis]) * sign;
    if (distance > 0 && distance < bestDistance) {
      best = i;
      bestDistance = distance;
    }
  });
  return best;
}

/** Index of the die nearest (Euclidean, in grid units) to `centre`, the first such on ties; null for no dies. */
export function nearestDie(dies: readonly GridPoint[], centre: GridPoint): number | null {
  let best: number | null = null;
  let bestDistance = Infinity;
  dies.forEach((die, i) => {
    const distance = Math.hypot(die.x - centre.x, die.y - centre.y);
    if (distance < bestDistance) {
      best = i;
      bestDistance = distance;
    }
  });
  return best;
}

/** Index of the die at grid position (x, y), the first on duplicates; null when there is none or no point given. */
export function findDie(dies: readonly GridPoint[], point: GridPoint | null | undefined): number | null {
  if (point == null) return null;
  const index = dies.findIndex((die) => die.x === point.x && die.y === point.y);
  return index < 0 ? null : index;
}
