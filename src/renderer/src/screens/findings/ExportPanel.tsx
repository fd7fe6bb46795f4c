/**
 * Export of one plot: PNG at a preset size or a custom one in millimetres or pixels, each at a
 * resolution, on white or transparent, with its title and the caption (project, policy, settings,
 * date and the short caution); SVG of the same; the grid as CSV for the surface. The panel says the
 * pixel count, the printed size in mm and inches, and the printed size of the tick labels (smaller
 * than on screen where the picture is too small for full-size type: exportPlan.ts). Images are
 * written by the chart worker; files go where the user says (main process).
 */
import { useMemo, useState } from 'react';
import { CAUTION, exportCaption, type PlotSpec } from '../../export';
import { exportInWorker } from '../../plots/chartHost';
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { TextField } from '../../components/TextField';
import type { Evaluation } from '../../../../pipeline/estimates';
import { exportPlan } from '../../../../figures/writers/exportPlan';
import { PLOT_FONTS } from '../../../../figures/parts/plotLook';
import { defaultTextMeasure } from '../../../../figures/writers/textMeasure';
import { useDocument } from '../../hooks';
import { fileNameText } from '../../../../shared/fileNameText';
import { useWorkspace } from '../../WorkspaceContext';
import { millimetrePixels, presetLabel, presetPixels, SIZE_PRESETS, sizeText, typePoints, type MillimetreSize, type PixelSize } from './exportSizes';
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

const PIXEL_FIELDS = { widthPx: 'Width (px)', heightPx: 'Height (px)', dpi: 'Resolution (dpi)' } as const;
const MM_FIELDS = { widthMm: 'Width (mm)', heightMm: 'Height (mm)', dpi: 'Resolution (dpi)' } as const;
const SIZE_OPTIONS = [
  ...SIZE_PRESETS.map((p) => ({ value: p.id, label: presetLabel(p) })),
  { value: 'custom-mm', label: 'Custom size in millimetres' }, { value: 'custom-px', label: 'Custom size in pixels' },
];

/** What the chosen size means in print, or why it cannot be exported (the export's own checks). */
function sizeCheck(spec: PlotSpec, size: PixelSize, caption: string): { ok: boolean; text: string } {
  try {
    const plan = exportPlan(spec, { ...size, background: 'white', caption, caution: CAUTION }, defaultTextMeasure());
    const points = typePoints(PLOT_FONTS.tickPx, plan.typeScale), full = typePoints(PLOT_FONTS.tickPx, 1);
    const type = plan.typeScale < 0.995 ? `tick labels ${points.toFixed(1)} pt (smaller than ${full} pt, so the plot fits)` : `tick labels ${full} pt`;
    return { ok: true, text: `${sizeText(size)}; ${type}` };
  } catch (error) {
    return { ok: false, text: `${sizeText(size)}: ${(error as Error).message}` };
  }
}

export function ExportPanel({ kind, evaluation, defaultTitle, policy, fileBase, makeSpec, csv }: Props) {
  const { api } = useWorkspace();
  const doc = useDocument();
  const [preset, setPreset] = useState('report');
  const [customPx, setCustomPx] = useState<PixelSize>({ widthPx: 1600, heightPx: 1000, dpi: 200 });
  const [customMm, setCustomMm] = useState<MillimetreSize>({ widthMm: 160, heightMm: 100, dpi: 300 });
  const [background, setBackground] = useState<'white' | 'transparent'>('white');
  const [title, setTitle] = useState<string | null>(null);
  const [status, setStatus] = useState<Status>(null);
  const size = preset === 'custom-px' ? customPx : preset === 'custom-mm' ? millimetrePixels(customMm) : presetPixels(SIZE_PRESETS.find((p) => p.id === preset) ?? SIZE_PRESETS[0]);
  const caption = exportCaption({ project: doc.name, policy, settings: settingsLine(evaluation), date: captionDate(evaluation.evaluatedAt) });
  const options = { ...size, background, caption, caution: CAUTION };
  const spec = () => makeSpec(title ?? defaultTitle);
  const { widthPx, heightPx, dpi } = size;
  const check = useMemo(() => sizeCheck(makeSpec(defaultTitle), { widthPx, heightPx, dpi }, caption), [widthPx, heightPx, dpi, caption, defaultTitle]);
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
  return (
    <details className="panel" data-testid={`export-${kind}`}>
      <summary>Export this plot</summary>
      <div className="row">
        <SelectField label="Size" value={preset} onChange={setPreset} testId={`export-size-${kind}`} className="size-field" options={SIZE_OPTIONS} />
        {preset === 'custom-mm' && (Object.keys(MM_FIELDS) as (keyof MillimetreSize)[]).map((key) => (
          <NumberField key={key} label={MM_FIELDS[key]} value={customMm[key]}
            onCommit={(v) => v !== null && v > 0 && setCustomMm((c) => ({ ...c, [key]: v }))} />
        ))}
        {preset === 'custom-px' && (Object.keys(PIXEL_FIELDS) as (keyof PixelSize)[]).map((key) => (
          <NumberField key={key} label={PIXEL_FIELDS[key]} value={customPx[key]}
            onCommit={(v) => v !== null && setCustomPx((c) => ({ ...c, [key]: Math.round(v) }))} />
        ))}
        <SelectField label="Background" value={background} onChange={setBackground}
          options={[{ value: 'white', label: 'White' }, { value: 'transparent', label: 'Transparent' }]} />
        <TextField label="Title" value={title ?? defaultTitle} className="wide" onChange={setTitle} />
      </div>
      <p className={check.ok ? 'small' : 'error-text'} data-testid={`export-size-text-${kind}`}>{check.text}</p>
      <p className="small muted" style={{ whiteSpace: 'pre-line' }}>Caption: {caption}</p>
      <div className="row">
        <button data-testid={`export-png-${kind}`} disabled={!check.ok} onClick={() => void save('PNG', async () => api.exportFile('png', fileNameText(`${fileBase}.png`), await exportInWorker(spec(), options, 'png')))}>Export PNG…</button>
        <button data-testid={`export-svg-${kind}`} disabled={!check.ok} onClick={() => void save('SVG', async () => api.exportFile('svg', fileNameText(`${fileBase}.svg`), await exportInWorker(spec(), options, 'svg')))}>Export SVG…</button>
        {csv && <button data-testid={`export-csv-${kind}`} onClick={() => void save('CSV', () => api.exportFile('csv', fileNameText(`${fileBase}.csv`), encode(csv())))}>Export grid as CSV…</button>}
      </div>
      {status && <p className={status.tone === 'error' ? 'error-text' : 'small'} role="status" data-testid={`export-status-${kind}`}>{status.text}</p>}
    </details>
  );
}
