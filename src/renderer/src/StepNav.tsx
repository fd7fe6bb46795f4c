/**
 * The step list on the left: one tab per step with its number, name and what it still needs.
 * Arrow keys move between steps (Home/End to the ends); Ctrl+1…5 work from anywhere (App).
 */
import { useRef } from 'react';
import { STEPS, type StepId, type StepStatus } from './steps';

export function StepNav(props: { current: StepId; statuses: Record<StepId, StepStatus>; onSelect: (id: StepId) => void }) {
  const list = useRef<HTMLOListElement>(null);
  const keyDown = (e: React.KeyboardEvent, index: number): void => {
    const moves: Record<string, number> = { ArrowDown: index + 1, ArrowRight: index + 1, ArrowUp: index - 1, ArrowLeft: index - 1, Home: 0, End: STEPS.length - 1 };
    if (!(e.key in moves)) return;
    e.preventDefault();
    const next = (moves[e.key] + STEPS.length) % STEPS.length;
    props.onSelect(STEPS[next].id);
    list.current?.querySelectorAll<HTMLButtonElement>('button')[next]?.focus();
  };
  return (
    <nav className="steps" aria-label="Workflow steps">
      <ol role="tablist" aria-orientation="vertical" ref={list}>
        {STEPS.map((step, index) => {
          const selected = step.id === props.current;
          const status = props.statuses[step.id];
          return (
            <li key={step.id} className={status.done ? 'done' : undefined}>
              <button
                role="tab" id={`tab-${step.id}`} aria-selected={selected} aria-controls="screen" tabIndex={selected ? 0 : -1}
                data-testid={`step-${step.id}`} title={`${step.purpose} (Ctrl+${index + 1})`}
                onClick={() => props.onSelect(step.id)} onKeyDown={(e) => keyDown(e, index)}
              >
                <span className="number" aria-hidden="true">{status.done ? '✓' : index + 1}</span>
                <span className="step-title">{step.title}</span>
                <span className="step-status">{status.status}</span>
              </button>
            </li>
          );
        })}
      </ol>
      <p className="shortcut-hint">Arrow keys move between steps; Ctrl+1 … Ctrl+5 jump to one.</p>
    </nav>
  );
}
