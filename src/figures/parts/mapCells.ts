/**
 * The cells of a two-axis retune map, worked out once from the map's data: each grid point is a
 * cell at its column and row index (so a logarithmic axis gets equal cells), with its value, its
 * shading and whether it is the best supported point. The colour domain spans the cells the logs
 * support or only thin out under (supported and caution): the unsupported cells can be far larger
 * and would otherwise squeeze the supported range into one colour; they are shaded and read their
 * exact values from the readout, their colour clamped at the scale's ends.
 *
 * Shapes: axes[0] gives nx columns, axes[1] ny rows; points are nx×ny row-major with the second
 * axis fastest, so point p sits at column ⌊p / ny⌋, row p mod ny.
 */
import type { MapSupport, RetuneMapData } from '../charts/figureData';

/** How a cell is drawn: its colour as it is, lightly hatched, greyed and strongly hatched, or "no value". */
export type CellShade = 'supported' | 'caution' | 'unsupported' | 'noValue';

export interface MapCell {
  readonly index: number;
  readonly column: number;
  readonly row: number;
  readonly value: number | null;
  readonly shade: CellShade;
}

export interface MapCellLayout {
  readonly columns: number;
  readonly rows: number;
  readonly cells: readonly MapCell[];
  /** Values that set the colour scale's domain: the supported cells', else supported and thin-log, else every finite value. */
  readonly domainValues: readonly number[];
  /** Index of the best supported point, or null. */
  readonly best: number | null;
}

export class MapShapeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MapShapeError';
  }
}

export function shadeOf(value: number | null, support: MapSupport): CellShade {
  if (value === null || !Number.isFinite(value)) return 'noValue';
  if (support === null) return 'supported';
  return support === 'caution' ? 'caution' : 'unsupported'; // 'serious' and 'unknown' alike: the logs do not vouch for it
}

export function mapCellLayout(map: RetuneMapData): MapCellLayout {
  if (map.axes.length !== 2) throw new MapShapeError(`retune map: the cell layout needs two axes, got ${map.axes.length}`);
  const columns = map.axes[0].values.length, rows = map.axes[1].values.length;
  if (map.points.length !== columns * rows) throw new MapShapeError(`retune map: expected ${columns}×${rows} = ${columns * rows} points, got ${map.points.length}`);
  const cells = map.points.map((p, index): MapCell => ({
    index, column: Math.floor(index / rows), row: index % rows, value: p.value, shade: shadeOf(p.value, p.support),
  }));
  const valuesOf = (shades: readonly CellShade[]) => cells.filter((c) => shades.includes(c.shade)).map((c) => c.value as number);
  const supported = valuesOf(['supported']), trusted = valuesOf(['supported', 'caution']);
  const domainValues = supported.length > 1 ? supported : trusted.length > 1 ? trusted : valuesOf(['supported', 'caution', 'unsupported']);
  const best = map.best !== null && map.best.index >= 0 && map.best.index < cells.length ? map.best.index : null;
  return { columns, rows, cells, domainValues, best };
}

export function shadeCount(layout: MapCellLayout, shade: CellShade): number {
  return layout.cells.filter((c) => c.shade === shade).length;
}
