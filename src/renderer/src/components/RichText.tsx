/** Rich-text markup (V^{π}, E_{a~π}) as HTML with real superscripts and subscripts (figures/parts/richText.ts). */
import { parseRichText } from '../../../figures/parts/richText';

export function RichText({ text }: { text: string }) {
  return <>{parseRichText(text).map((run, i) => (run.kind === 'sup' ? <sup key={i}>{run.text}</sup> : run.kind === 'sub' ? <sub key={i}>{run.text}</sub> : <span key={i}>{run.text}</span>))}</>;
}
