/**
 * The app's own modal dialog for the question store: focus moves to the default button, Tab stays
 * inside, Escape gives the dismiss answer.
 */
import { useEffect, useRef } from 'react';
import { useStore } from '../state/useStore';
import type { QuestionStore } from '../state/questionStore';

const select = <T,>(x: T) => x;

export function DialogHost(props: { questions: QuestionStore }) {
  const asked = useStore(props.questions, select);
  const dialog = useRef<HTMLDivElement>(null);
  useEffect(() => {
    dialog.current?.querySelector<HTMLButtonElement>('button.primary, button')?.focus();
  }, [asked]);
  if (!asked) return null;
  const { question, answer } = asked;
  const keyDown = (e: React.KeyboardEvent): void => {
    if (e.key === 'Escape') {
      e.preventDefault();
      answer(question.dismiss);
    }
    if (e.key !== 'Tab' || !dialog.current) return;
    const buttons = [...dialog.current.querySelectorAll('button')];
    const index = buttons.indexOf(document.activeElement as HTMLButtonElement);
    const next = e.shiftKey ? (index <= 0 ? buttons.length - 1 : index - 1) : (index + 1) % buttons.length;
    e.preventDefault();
    buttons[next]?.focus();
  };
  return (
    <div className="modal-backdrop">
      <div className="modal" role="alertdialog" aria-modal="true" aria-labelledby="dialog-title" aria-describedby="dialog-body" ref={dialog} onKeyDown={keyDown}>
        <h2 id="dialog-title">{question.title}</h2>
        <p id="dialog-body">{question.body}</p>
        <div className="buttons">
          {question.choices.map((c) => (
            <button key={c.id} className={c.primary ? 'primary' : undefined} onClick={() => answer(c.id)}>{c.label}</button>
          ))}
        </div>
      </div>
    </div>
  );
}
