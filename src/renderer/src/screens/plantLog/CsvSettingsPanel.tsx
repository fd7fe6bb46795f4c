/** How the CSV is read: delimiter, decimal mark, and what to do with rows that cannot be used. */
import { SelectField } from '../../components/SelectField';
import type { CsvSettings } from '../../../../project/schema';
import { useDocument, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';

const DELIMITERS = [
  { value: 'auto', label: 'Detect' }, { value: ',', label: 'Comma ,' }, { value: ';', label: 'Semicolon ;' }, { value: '\t', label: 'Tab' },
] as const;
const DECIMALS = [{ value: 'auto', label: 'Detect' }, { value: '.', label: 'Point 1.5' }, { value: ',', label: 'Comma 1,5' }] as const;
const BAD_ROWS = [{ value: 'stop', label: 'Stop the import' }, { value: 'exclude', label: 'Leave them out and list them' }] as const;

export function CsvSettingsPanel() {
  const { documents } = useWorkspace();
  const csv = useDocument().data.csv;
  const inspection = useSession().inspection;
  const set = (change: Partial<CsvSettings>, label: string): void =>
    documents.edit(label, (d) => ({ ...d, data: { ...d.data, csv: { ...d.data.csv, ...change } } }));
  const detected = inspection
    ? `Read as ${inspection.delimiter === '\t' ? 'tab' : `“${inspection.delimiter}”`}-separated, decimal mark “${inspection.decimalMark}”.`
    : undefined;
  const encoding = inspection?.encoding;
  return (
    <section className="panel" aria-labelledby="csv-heading">
      <h3 id="csv-heading">CSV settings</h3>
      <div className="row">
        <SelectField label="Delimiter" value={csv.delimiter} options={DELIMITERS} help={detected ?? 'The character between fields.'} onChange={(delimiter) => set({ delimiter }, 'change the delimiter')} />
        <SelectField label="Decimal mark" value={csv.decimalMark} options={DECIMALS} help="Point (1.5) or comma (1,5) in numbers." onChange={(decimalMark) => set({ decimalMark }, 'change the decimal mark')} />
        <SelectField label="Rows that cannot be used" value={csv.badRows} options={BAD_ROWS} help="Stop and list the problems, or import without those rows." testId="bad-rows" onChange={(badRows) => set({ badRows }, 'change how bad rows are handled')} />
      </div>
      {encoding && (
        <p className="small muted" data-testid="text-encoding">
          Text encoding: <strong>{encoding.name}</strong> ({encoding.how === 'byte-order mark' ? 'from the file’s byte-order mark' : encoding.name === 'Windows-1252' ? 'detected: the bytes are not UTF-8' : 'detected'}).
        </p>
      )}
    </section>
  );
}
