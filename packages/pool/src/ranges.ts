/**
 * Tile planning: cuts flat item ranges ("segments", e.g. one face of one mip level) into tiles of a
 * target cost, aligned to whole rows, heaviest first. The pool knows nothing of what an item is.
 */

export interface Segment {
  /** First item (inclusive) and end (exclusive) of the segment in the kernel's flat index space. */
  readonly begin: number;
  readonly end: number;
  /** Cost of one item in arbitrary units (e.g. samples per texel). */
  readonly costPerItem: number;
  /** Tiles start and end on multiples of this many items from `begin` (a row of a face); 1 = anywhere. */
  readonly rowLength?: number;
  /** Human-readable name used in errors and progress, e.g. "level 3 face +X". */
  readonly label?: string;
}

export interface Tile {
  readonly segment: number;
  readonly begin: number;
  readonly end: number;
  readonly cost: number;
}

export interface TilePlanOptions {
  /** Cost units per tile to aim for; a tile is never smaller than one row. */
  readonly targetCost: number;
  /** Upper bound on items per tile (keeps tiles responsive to abort); default unbounded. */
  readonly maxItems?: number;
}

/** Splits segments into tiles; the result is sorted by cost, heaviest first (stable on ties). */
export function planTiles(segments: readonly Segment[], options: TilePlanOptions): Tile[] {
  const tiles: Tile[] = [];
  const target = Math.max(1, options.targetCost);
  const maxItems = options.maxItems ?? Number.MAX_SAFE_INTEGER;
  for (let s = 0; s < segments.length; s++) {
    const seg = segments[s]!;
    const count = seg.end - seg.begin;
    if (count <= 0) continue;
    const row = Math.max(1, Math.floor(seg.rowLength ?? 1));
    const rows = Math.ceil(count / row);
    const rowCost = row * Math.max(seg.costPerItem, 1e-9);
    let rowsPerTile = Math.max(1, Math.floor(target / rowCost));
    rowsPerTile = Math.max(1, Math.min(rowsPerTile, Math.floor(maxItems / row)));
    for (let r = 0; r < rows; r += rowsPerTile) {
      const begin = seg.begin + r * row;
      const end = Math.min(seg.end, begin + rowsPerTile * row);
      tiles.push({ segment: s, begin, end, cost: (end - begin) * seg.costPerItem });
    }
  }
  // Heaviest first keeps the tail of a job short; ties keep plan order so plans are reproducible.
  return tiles
    .map((tile, index) => ({ tile, index }))
    .sort((a, b) => b.tile.cost - a.tile.cost || a.index - b.index)
    .map((entry) => entry.tile);
}

/** Total cost of a plan, the denominator of progress. */
export function totalCost(tiles: readonly Tile[]): number {
  let sum = 0;
  for (const tile of tiles) sum += tile.cost;
  return sum;
}
