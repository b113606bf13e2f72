/**
 * The explorer's plots: pure client components that draw an ExplorationRun.
 * - LinePlot: a one-variable sweep (lines, thermal bands, reference, revision);
 * - ColourMap: a two-variable sweep on a canvas;
 * - TernaryMap: a ternary composition map on a canvas;
 * - PointsTable: the same points as a paged, sortable table.
 * Each root carries data-testid ("line-plot", "colour-map", "ternary-map",
 * "points-table") and data-figure-min / data-figure-max / data-figure-unit
 * (the drawn figure's range in shown units).
 */
export { LinePlot, type LinePlotProps } from "./line-plot";
export { ColourMap, type ColourMapProps } from "./colour-map";
export { TernaryMap, type TernaryMapProps } from "./ternary-map";
export { PointsTable, type PointsTableProps } from "./points-table";
