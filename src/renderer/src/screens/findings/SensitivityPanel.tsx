/** J against the discount and against the feature degree (or centres, or network width), one sweep at a time, with its export. */
import { useMemo, useState } from 'react';
import type { Sensitivity } from '../../../../pipeline/assessment';
import type { Evaluation } from '../../../../pipeline/estimates';
import { SelectField } from '../../components/SelectField';
import { SensitivityPlot } from '../../plots';
import { beyondPossibleSentence, unconvergedPointsSentence, rankingSentence, sweepsVerdict } from '../../../../figures/charts/sensitivity';
import type { Theme } from '../../theme';
import { ExportPanel } from './ExportPanel';
import { FoldPanel } from './FoldPanel';
import { displayName, policyValueLabel, valueUnit } from './plotLabels';
import { useDocument } from '../../hooks';

export function SensitivityPanel({ sensitivity, evaluation, theme }: { sensitivity: Sensitivity; evaluation: Evaluation; theme: Theme }) {
  const [index, setIndex] = useState(0);
  const doc = useDocument();
  const curve = sensitivity.curves[index] ?? sensitivity.curves[0];
  const shown = useMemo(() => curve && { ...curve, series: curve.series.map((s) => ({ ...s, name: displayName(s.name) })) }, [curve]);
  if (!curve || !shown) return null;
  const crossed = beyondPossibleSentence(curve, displayName), missing = unconvergedPointsSentence(curve, displayName);
  const title = `J against the ${curve.label}`;
  const props = { curve: shown, valueLabel: policyValueLabel(evaluation.valueSense, valueUnit(doc)), title, theme };
  return (
    <FoldPanel section="sensitivity" testId="sensitivity" gist={`J against ${sensitivity.curves.map((c) => `the ${c.label}`).join(' and ')}: ${sweepsVerdict(sensitivity.curves)}.`}>
      <p className="small muted">J refitted at other settings on the full data. If the lines cross inside the range, the conclusion depends on that setting.</p>
      {sensitivity.curves.length > 1 && (
        <div className="row">
          <SelectField label="Setting" value={String(index)} onChange={(v) => setIndex(Number(v))} testId="sensitivity-curve" className="fit-field"
            options={sensitivity.curves.map((c, i) => ({ value: String(i), label: c.label }))} />
        </div>
      )}
      <SensitivityPlot {...props} />
      <p data-testid="sensitivity-verdict">{rankingSentence(curve)}{curve.rankingStable ? '' : ' The conclusion depends on this setting.'}</p>
      {crossed && <p className="small" data-testid="sensitivity-crossed">{crossed}</p>}
      {missing && <p className="small" data-testid="sensitivity-unconverged">{missing}</p>}
      {sensitivity.notes.map((n) => <p key={n} className="small muted">{n}</p>)}
      <ExportPanel kind="sensitivity" evaluation={evaluation} defaultTitle={title} policy={curve.series.map((s) => s.name).join(', ')}
        fileBase={`sensitivity-${curve.parameter}`} makeSpec={(t) => ({ kind: 'sensitivity', props: { ...props, title: t } })} />
    </FoldPanel>
  );
}
