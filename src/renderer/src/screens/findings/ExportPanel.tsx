/**
 * Export of one plot: PNG at a preset or custom size and resolution, on white or transparent, with
 * its title and the caption (project, policy, settings, date and the short caution); SVG where the
 * exporter can write it; the grid as CSV for the surface. Files go where the user says (main process).
 */
import { useState } from 'react';
import { CAUTION, exportCaption, type PlotSpec } from '../../export';
import { exportInWorker } from '../../plots/chartHost';
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { TextField } from '../../components/TextField';
import type { Evaluation } from '../../../../pipeline/estimates';
import { useDocument } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';
import { presetPixels, printedInches, SIZE_PRESETS, type PixelSize } from './exportSizes';
import { captionDate, settingsLine } from './plotLabels';

interface Props {
  kind: PlotSpec['kind'];
  evaluation: Evaluation;
  defaultTitle: string;
  policy: string;
  fileBase: string;
  makeSpec: (title: string) => PlotSpec;
  csv?: () => string;
}

type Status = { tone: 'info' | 'error'; text: string } | null;

export function ExportPanel({ kind, evaluation, defaultTitle, policy, fileBase, makeSpec, csv }: Props) {
  const { api } = useWorkspace();
  const doc = useDocument();
  const [preset, setPreset] = useState('report');
  const [custom, setCustom] = useState<PixelSize>({ widthPx: 1600, heightPx: 1000, dpi: 200 });
  const [background, setBackground] = useState<'white' | 'transparent'>('white');
  const [title, setTitle] = useState<string | null>(null);
  const [status, setStatus] = useState<Status>(null);
  const size = preset === 'custom' ? custom : presetPixels(SIZE_PRESETS.find((p) => p.id === preset) ?? SIZE_PRESETS[0]);
  const caption = exportCaption({ project: doc.name, policy, settings: settingsLine(evaluation), date: captionDate(evaluation.evaluatedAt) });
  const options = { ...size, background, caption, caution: CAUTION };
  const spec = () => makeSpec(title ?? defaultTitle);
  const save = async (what: string, run: () => Promise<{ path: string } | null>): Promise<void> => {
    setStatus({ tone: 'info', text: `Exporting ${what}…` });
    try {
      const written = await run();
      setStatus(written ? { tone: 'info', text: `Saved ${written.path}` } : null);
    } catch (e) {
      setStatus({ tone: 'error', text: `${what} export failed: ${(e as Error).message}` });
    }
  };
  const encode = (text: string) => new TextEncoder().encode(text);
  const inches = printedInches(size);
  return (
    <details className="panel" data-testid={`export-${kind}`}>
      <summary>Export this plot</summary>
      <div className="row">
        <SelectField label="Size" value={preset} onChange={setPreset} testId={`export-size-${kind}`}
          options={[...SIZE_PRESETS.map((p) => ({ value: p.id, label: p.label })), { value: 'custom', label: 'Custom pixels and dpi' }]}
          help={`${size.widthPx} × ${size.heightPx} px, prints at ${inches.widthIn.toFixed(2)} × ${inches.heightIn.toFixed(2)} in`} />
        {preset === 'custom' && (['widthPx', 'heightPx', 'dpi'] as const).map((key) => (
          <NumberField key={key} label={{ widthPx: 'Width (px)', heightPx: 'Height (px)', dpi: 'Resolution (dpi)' }[key]} value={custom[key]}
            onCommit={(v) => v !== null && setCustom((c) => ({ ...c, [key]: Math.round(v) }))} />
        ))}
        <SelectField label="Background" value={background} onChange={setBackground}
          options={[{ value: 'white', label: 'White' }, { value: 'transparent', label: 'Transparent' }]} />
        <TextField label="Title" value={title ?? defaultTitle} className="wide" onChange={setTitle} />
      </div>
      <p className="small muted">Caption: {caption}</p>
      <div className="row">
        <button data-testid={`export-png-${kind}`} onClick={() => void save('PNG', async () => api.exportFile('png', `${fileBase}.png`, await exportInWorker(spec(), options, 'png')))}>Export PNG…</button>
        <button data-testid={`export-svg-${kind}`} onClick={() => void save('SVG', async () => api.exportFile('svg', `${fileBase}.svg`, await exportInWorker(spec(), options, 'svg')))}>Export SVG…</button>
        {csv && <button data-testid={`export-csv-${kind}`} onClick={() => void save('CSV', () => api.exportFile('csv', `${fileBase}.csv`, encode(csv())))}>Export grid as CSV…</button>}
      </div>
      {status && <p className={status.tone === 'error' ? 'error-text' : 'small'} role="status" data-testid={`export-status-${kind}`}>{status.text}</p>}
    </details>
  );
}
