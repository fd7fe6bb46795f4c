/**
 * Any plot spec on screen: its accessible name (the plot's title), its text summary and its
 * screen height come from src/figures, the drawing from the chart worker. Keep the spec object the
 * same while nothing in it changes (useMemo): a new object is a new drawing.
 */
import { useMemo } from 'react';
import { plotPalette } from '../../../figures/parts/plotTheme';
import { plotScreenHeight, plotSummary, plotTitle, type PlotSpec } from '../../../figures/writers/plotSpec';
import type { PlotFrame } from './chartMessages';
import { ChartFigure } from './ChartFigure';

interface PlotFigureProps {
  spec: PlotSpec;
  keyColumns?: number;
  testId?: string;
  /** Where each drawing put its plot area (see ChartFigure). */
  onFrame?: (frame: PlotFrame | null) => void;
}

export function PlotFigure({ spec, keyColumns, testId, onFrame }: PlotFigureProps) {
  const summary = useMemo(() => plotSummary(spec), [spec]);
  return (
    <ChartFigure
      testId={testId ?? `plot-${spec.kind}`} label={plotTitle(spec)} summary={summary} heightPx={plotScreenHeight(spec)}
      palette={plotPalette(spec.props.theme)} spec={spec} keyColumns={keyColumns} onFrame={onFrame}
    />
  );
}
