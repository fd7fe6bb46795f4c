/**
 * One Findings section as a panel the reader can fold: its heading is a button (aria-expanded) and,
 * folded, it keeps one line saying what is inside (the gist), so nothing becomes unreachable. A
 * folded section's content is not rendered, so its figures cost nothing until opened.
 */
import type { ReactNode } from 'react';
import { sectionElementId, sectionOf, type SectionId } from './findingsSections';
import { useFold } from './useFold';

interface Props {
  section: SectionId;
  /** Grid span: 'span-2' (two columns where there are two or more) or 'span-all'. */
  span?: 'span-2' | 'span-all';
  testId?: string;
  /** One line shown while folded. */
  gist?: ReactNode;
  /** Heading text when it differs from the section's name. */
  title?: string;
  children: ReactNode;
}

export function FoldPanel({ section, span, testId, gist, title, children }: Props) {
  const [open, setOpen] = useFold(section);
  const id = sectionElementId(section), body = `${id}-body`;
  return (
    <section className={['panel', 'fold', span ?? '', open ? 'open' : 'folded'].join(' ').trim()} id={id} aria-labelledby={`${id}-heading`}
      data-testid={testId} data-section={section} data-open={String(open)}>
      <h3 id={`${id}-heading`} className="fold-heading">
        <button type="button" className="fold-toggle" aria-expanded={open} aria-controls={body} onClick={() => setOpen(!open)}
          data-testid={`fold-${section}`}>
          <span className="fold-mark" aria-hidden="true">{open ? '▾' : '▸'}</span>{title ?? sectionOf(section).title}
        </button>
      </h3>
      {!open && gist && <p className="small muted fold-gist" data-testid={`gist-${section}`}>{gist}</p>}
      <div id={body} className="fold-body" hidden={!open}>{open && children}</div>
    </section>
  );
}
