/** A labelled text input (or text area) bound to one document field. */
import { useId } from 'react';

export interface TextFieldProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
  help?: string;
  message?: string | null;
  multiline?: boolean;
  onBlur?: () => void;
  className?: string;
  placeholder?: string;
  hideLabel?: boolean;
  /** The id of a <datalist> whose options the field offers while typing. */
  list?: string;
}

export function TextField(props: TextFieldProps) {
  const id = useId();
  const common = {
    id, value: props.value, placeholder: props.placeholder, onBlur: props.onBlur,
    'aria-invalid': Boolean(props.message), 'aria-describedby': `${id}-help ${id}-message`,
  };
  return (
    <div className={`field ${props.className ?? ''}`}>
      <label htmlFor={id} className={props.hideLabel ? 'sr-only' : undefined}>{props.label}</label>
      {props.multiline
        ? <textarea {...common} rows={2} onChange={(e) => props.onChange(e.target.value)} />
        : <input {...common} list={props.list} onChange={(e) => props.onChange(e.target.value)} />}
      {props.help && <span id={`${id}-help`} className="help">{props.help}</span>}
      {props.message && <span id={`${id}-message`} className="message" role="alert">{props.message}</span>}
    </div>
  );
}
