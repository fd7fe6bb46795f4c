/**
 * Each candidate's mean action against the logged actions over one state axis (the figure is
 * src/figures/charts/candidateActions.ts; the chart worker draws it).
 */
import { useMemo } from 'react';
import type { PlotSpec } from '../../../../figures/writers/plotSpec';
import type { ProjectDocument } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';
import { PlotFigure } from '../../plots';
import { useStore } from '../../state/useStore';
import { themeStore, type Theme } from '../../theme';
import { candidateActionsProps } from './meanActionLines';

const same = (t: Theme) => t;

interface Props {
  doc: ProjectDocument;
  imported: DataImport;
  axis: number;
  action: number;
}

export function CandidateChart({ doc, imported, axis, action }: Props) {
  const theme = useStore(themeStore, same);
  const { candidates, columns } = doc;
  const spec = useMemo<PlotSpec>(
    // Only the candidates and the column roles are drawn: other edits keep the same spec (no redraw).
    () => ({ kind: 'candidates', props: candidateActionsProps(doc, imported, axis, action, theme) }),
    [candidates, columns, imported, axis, action, theme],
  );
  return <PlotFigure spec={spec} testId="candidate-chart" />;
}
