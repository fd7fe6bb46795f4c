/**
 * The Findings section index: one button per section on the screen, in reading order, that opens
 * it and brings it into view; it stays in view under the toolbar while the screen scrolls. A folded
 * section is marked ▸; a note (such as a count of serious warnings) can stand beside a name. Open
 * all and Fold all change every section at once, also those still being computed (remembered like a single fold).
 */
import { useCallback } from 'react';
import { FINDINGS_SECTIONS, type SectionId } from './findingsSections';
import { isOpen, setOpen } from './foldMemory';
import { jumpToSection, useFoldChoices } from './useFold';

/** Keeps --findings-index-height on <html> equal to the index's height, so a section scrolled to is not hidden under it. */
function useIndexHeight(): (element: HTMLElement | null) => (() => void) | undefined {
  return useCallback((element: HTMLElement | null) => {
    if (!element || typeof ResizeObserver === 'undefined') return undefined;
    const set = () => document.documentElement.style.setProperty('--findings-index-height', `${element.getBoundingClientRect().height}px`);
    set();
    const observer = new ResizeObserver(set);
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
}

/** Every section, also those a run has not produced yet (the checks while they are computed): "all" means all. */
const ALL = FINDINGS_SECTIONS.map((s) => s.id);

export function SectionIndex({ present, notes = {} }: { present: readonly SectionId[]; notes?: Partial<Record<SectionId, string>> }) {
  const { key, choices } = useFoldChoices();
  const ref = useIndexHeight();
  const sections = FINDINGS_SECTIONS.filter((s) => present.includes(s.id));
  return (
    <nav className="section-index" aria-label="Findings sections" data-testid="section-index" ref={ref}>
      <ul>
        {sections.map((s) => {
          const open = isOpen(choices, key, s.id);
          return (
            <li key={s.id}>
              <button type="button" className={open ? 'open' : 'folded'} onClick={() => jumpToSection(key, s.id)} data-testid={`index-${s.id}`}
                title={open ? `Go to ${s.title}` : `Open and go to ${s.title} (folded)`}>
                <span aria-hidden="true">{open ? '▾' : '▸'}</span> {s.short}
                {notes[s.id] && <span className="index-note">{notes[s.id]}</span>}
              </button>
            </li>
          );
        })}
      </ul>
      <span className="index-tools">
        <button type="button" onClick={() => setOpen(key, ALL, true)} data-testid="open-all-sections">Open all</button>
        <button type="button" onClick={() => setOpen(key, ALL, false)} data-testid="fold-all-sections">Fold all</button>
      </span>
    </nav>
  );
}
