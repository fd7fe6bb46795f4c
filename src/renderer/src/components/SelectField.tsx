/** A labelled select with a one-line explanation. */
import { useId } from 'react';
import { RichText } from './RichText';

export interface SelectFieldProps<V extends string> {
  label: string;
  value: V;
  options: readonly { value: V; label: string }[];
  onChange: (value: V) => void;
  help?: string;
  message?: string | null;
  hideLabel?: boolean;
  testId?: string;
  className?: string;
}

export function SelectField<V extends string>(props: SelectFieldProps<V>) {
  const id = useId();
  return (
    <div className={props.className ? `field ${props.className}` : 'field'}>
      <label htmlFor={id} className={props.hideLabel ? 'sr-only' : undefined}><RichText text={props.label} /></label>
      <select
        id={id} value={props.value} data-testid={props.testId} aria-invalid={Boolean(props.message)} aria-describedby={`${id}-help`}
        onChange={(e) => props.onChange(e.target.value as V)}
      >
        {props.options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
      </select>
      {props.help && <span id={`${id}-help`} className="help"><RichText text={props.help} /></span>}
      {props.message && <span className="message" role="alert">{props.message}</span>}
    </div>
  );
}
