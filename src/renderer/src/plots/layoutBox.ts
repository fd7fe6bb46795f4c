/**
 * The geometry every Chart.js layout box carries: Chart.js's layout engine reads and writes these
 * fields. Our boxes (colour bar, unvisited-region legend, room for value labels) extend this and
 * add their position, weight, sizing and drawing.
 */
export abstract class LayoutBoxGeometry {
  readonly fullSize = false;
  /** Chart.js reads stack options from every layout box. */
  readonly options = {};
  width = 0;
  height = 0;
  left = 0;
  top = 0;
  right = 0;
  bottom = 0;
}
