/**
 * A labelled number input that commits a value to the document only when its text is a number,
 * with a one-line explanation under it and the document's validation message beside it. While the
 * text is not a number the field says so and the document keeps its last value.
 */
import { useEffect, useId, useState } from 'react';
import { editableNumber, parseNumber } from '../format/numberFormat';
import { RichText } from './RichText';

export interface NumberFieldProps {
  /** Plain text, or RichText markup for a symbol's subscript ("K_{c}"). */
  label: string;
  value: number | null;
  onCommit: (value: number | null) => void;
  help?: string;
  /** The document's validation message for this field. */
  message?: string | null;
  /** Blank is allowed and commits null (e.g. "no limit"). */
  allowBlank?: boolean;
  placeholder?: string;
  onBlur?: () => void;
  className?: string;
  hideLabel?: boolean;
}

export function NumberField(props: NumberFieldProps) {
  const id = useId();
  const [text, setText] = useState(editableNumber(props.value));
  const [ownMessage, setOwnMessage] = useState<string | null>(null);
  useEffect(() => {
    // Follow the document (undo, redo, another field) unless the text already means this value.
    setText((current) => (parseNumber(current) === props.value ? current : editableNumber(props.value)));
    setOwnMessage(null);
  }, [props.value]);
  const change = (next: string): void => {
    setText(next);
    if (next.trim() === '' && props.allowBlank) {
      setOwnMessage(null);
      props.onCommit(null);
      return;
    }
    const value = parseNumber(next);
    setOwnMessage(value === null ? 'expected a number, e.g. 12.5 or 1e-6' : null);
    if (value !== null) props.onCommit(value);
  };
  const message = ownMessage ?? props.message ?? null;
  return (
    <div className={`field ${props.className ?? ''}`}>
      <label htmlFor={id} className={props.hideLabel ? 'sr-only' : undefined}><RichText text={props.label} /></label>
      <input
        id={id} inputMode="decimal" value={text} placeholder={props.placeholder} className="narrow"
        aria-invalid={message !== null} aria-describedby={`${id}-help ${id}-message`}
        onChange={(e) => change(e.target.value)} onBlur={props.onBlur}
      />
      {props.help && <span id={`${id}-help`} className="help"><RichText text={props.help} /></span>}
      {message && <span id={`${id}-message`} className="message" role="alert">{message}</span>}
    </div>
  );
}
